export interface MailCatcher {
  port: number;
  dir: string;
  close(): Promise<void>;
}

export function startMailCatcher(options: { dir: string; port?: number; host?: string }): Promise<MailCatcher>;
