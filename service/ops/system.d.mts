export const isRoot: boolean;
export const chromiumPath: string;
export function log(message: string): void;
export function ensureDependencies(root: string): void;
export function ensureChromium(): void;
export function aptInstall(packages: string[], why: string): void;
