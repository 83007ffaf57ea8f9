/** Tiny helpers for asserting on renderToStaticMarkup output without a DOM. */

/** The opening tags of all elements named `tag`. */
export function openTags(html: string, tag: string): string[] {
  return [...html.matchAll(new RegExp(`<${tag}(?=[\\s>/])[^>]*>`, "g"))].map((m) => m[0]);
}

/** The value of `name` in one opening tag, or undefined (entities left as written). */
export function attr(openTag: string, name: string): string | undefined {
  const m = new RegExp(`\\s${name.replace(/[-]/g, "\\-")}="([^"]*)"`).exec(openTag);
  return m?.[1];
}

/** The one opening tag of `tag` (throws when there is not exactly one). */
export function onlyTag(html: string, tag: string): string {
  const tags = openTags(html, tag);
  if (tags.length !== 1) throw new Error(`expected one <${tag}>, found ${tags.length} in ${html}`);
  return tags[0] as string;
}

/** Text content with tags stripped and the common entities decoded. */
export function textOf(html: string): string {
  return html
    .replace(/<[^>]+>/g, "")
    .replace(/&nbsp;|&#xA0;|&#160;/g, "\u00a0")
    .replace(/&amp;/g, "&")
    .replace(/&lt;/g, "<")
    .replace(/&gt;/g, ">")
    .replace(/&quot;/g, '"')
    .replace(/&#x27;|&#39;/g, "'");
}
