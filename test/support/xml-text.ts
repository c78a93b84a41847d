/** The five XML entities read back into their characters (`&amp;` last, so `&amp;lt;` stays `&lt;`). */
export function xmlEntitiesRead(text: string): string {
  return text
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&quot;/g, '"')
    .replace(/&apos;/g, "'")
    .replace(/&amp;/g, '&');
}

/** A WordprocessingML part's text: tabs as tabs, a line per paragraph, the markup dropped, entities read. */
export function wordText(xml: string): string {
  return xmlEntitiesRead(
    xml
      .replace(/<w:tab\/>/g, '\t')
      .replace(/<\/w:p>/g, '\n')
      .replace(/<[^>]+>/g, ''),
  );
}
