/**
 * A deliberately small text-to-HTML converter for comments: **bold**, *italic*,
 * "- " list items, [text](https://…) links, blank-line paragraphs. Everything else is
 * escaped, so the composer never sends markup the person did not mean; the server
 * sanitizes again anyway.
 */

function escapeHtml(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

const SAFE_URL = /^(https?:\/\/|mailto:)[^\s"<>]+$/i;

function inline(raw: string): string {
  let s = escapeHtml(raw);
  // Links first so asterisks inside a URL are not read as emphasis.
  const links: string[] = [];
  s = s.replace(/\[([^\]\n]+)\]\(([^)\s]+)\)/g, (whole, text: string, url: string) => {
    const href = url.replace(/&amp;/g, '&');
    if (!SAFE_URL.test(href)) return whole;
    links.push(`<a href="${escapeHtml(href)}" rel="noopener noreferrer">${text}</a>`);
    return `\u0000${links.length - 1}\u0000`;
  });
  s = s.replace(/\*\*([^*\n]+)\*\*/g, '<strong>$1</strong>');
  s = s.replace(/(^|[^*])\*([^*\n]+)\*(?!\*)/g, '$1<em>$2</em>');
  return s.replace(/\u0000(\d+)\u0000/g, (_m, i: string) => links[Number(i)]);
}

/** Converts the composer's text to the HTML the API stores. */
export function markdownLiteToHtml(text: string): string {
  const blocks = text.replace(/\r\n?/g, '\n').trim().split(/\n\s*\n/);
  const out: string[] = [];
  for (const block of blocks) {
    if (!block.trim()) continue;
    const lines = block.split('\n');
    if (lines.every((l) => /^\s*[-*]\s+/.test(l))) {
      out.push(`<ul>${lines.map((l) => `<li>${inline(l.replace(/^\s*[-*]\s+/, ''))}</li>`).join('')}</ul>`);
    } else {
      out.push(`<p>${lines.map(inline).join('<br>')}</p>`);
    }
  }
  return out.join('');
}

/** Wraps the selected part of `value` in a marker (bold, italic) and returns the new text and selection. */
export function wrapSelection(value: string, start: number, end: number, before: string, after = before, placeholder = 'text'): { value: string; start: number; end: number } {
  const picked = value.slice(start, end) || placeholder;
  const next = value.slice(0, start) + before + picked + after + value.slice(end);
  return { value: next, start: start + before.length, end: start + before.length + picked.length };
}

/** Turns the lines touched by the selection into "- " list items. */
export function listSelection(value: string, start: number, end: number): { value: string; start: number; end: number } {
  const lineStart = value.lastIndexOf('\n', start - 1) + 1;
  const lineEndIdx = value.indexOf('\n', end);
  const lineEnd = lineEndIdx === -1 ? value.length : lineEndIdx;
  const body = value.slice(lineStart, lineEnd).split('\n').map((l) => (/^\s*[-*]\s+/.test(l) ? l : `- ${l}`)).join('\n');
  const next = value.slice(0, lineStart) + body + value.slice(lineEnd);
  return { value: next, start: lineStart, end: lineStart + body.length };
}
