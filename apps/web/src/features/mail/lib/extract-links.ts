/**
 * The http(s) links in a plain-text e-mail, in order, without duplicates. The HTML part is shown in a
 * sandbox where links cannot open, so the viewer lists these to follow an invitation or a reset link.
 * Trailing punctuation that ends a sentence is not part of the link.
 */
export function extractLinks(text: string): string[] {
  const found = text.match(/https?:\/\/[^\s<>"')\]]+/g) ?? [];
  const links: string[] = [];
  for (const raw of found) {
    const link = raw.replace(/[.,;:!?]+$/, '');
    try {
      const url = new URL(link);
      if (url.protocol !== 'http:' && url.protocol !== 'https:') continue;
    } catch {
      continue;
    }
    if (!links.includes(link)) links.push(link);
  }
  return links;
}

/**
 * A link to this app's own origin becomes a relative path, so following an invitation from the
 * Outbox stays in the same tab and session; anything else stays absolute.
 */
export function toInAppPath(link: string, origin: string): string | null {
  try {
    const url = new URL(link);
    if (url.origin !== origin) return null;
    return `${url.pathname}${url.search}${url.hash}`;
  } catch {
    return null;
  }
}
