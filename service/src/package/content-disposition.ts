/**
 * A Content-Disposition header for a download: `filename` in plain ASCII (accents dropped, anything
 * else that a header or a file system trips on replaced), and `filename*` with the name as written,
 * in UTF-8 (RFC 6266, RFC 8187).
 */
export function attachment(name: string): string {
  const ascii =
    name
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .replace(/[^\x20-\x7e]|["\\/:*?<>|%;]/g, '_')
      .replace(/\s+/g, ' ')
      .trim() || 'package';
  const safe = Array.from(name, (character) =>
    character.charCodeAt(0) < 0x20 || character === '\u007f' || '\\/:*?<>|"'.includes(character) ? '_' : character,
  ).join('');
  const encoded = encodeURIComponent(safe).replace(/['()*]/g, (character) => `%${character.charCodeAt(0).toString(16).toUpperCase()}`);
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encoded}`;
}
