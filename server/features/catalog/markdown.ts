/**
 * Seller descriptions to safe HTML. Markdown is rendered with HTML disabled: any raw HTML in the
 * text (`<img src=x onerror=…>`, `<script>`) is escaped and shows as text; links keep only http(s)
 * and mailto targets; images become their alt text (no third-party requests from our pages).
 * Plain text is escaped, with blank lines as paragraphs and single line breaks kept.
 */
import { Marked, type Tokens } from 'marked';
import { escapeHtml } from '../../integrations/mailer.ts';

const md = new Marked({ gfm: true, breaks: true, async: false });
md.use({
  renderer: {
    html(t: Tokens.HTML | Tokens.Tag) {
      return 'block' in t && t.block ? `<p>${escapeHtml(t.text)}</p>` : escapeHtml(t.text);
    },
    image(t: Tokens.Image) {
      return escapeHtml(t.text);
    },
    link(this: { parser: { parseInline(tokens: Tokens.Generic[]): string } }, t: Tokens.Link) {
      const text = this.parser.parseInline(t.tokens);
      return /^(https?:\/\/|mailto:)/i.test(t.href) ? `<a href="${escapeHtml(t.href)}" rel="nofollow noopener noreferrer ugc">${text}</a>` : text;
    },
  },
});

export function renderDescription(text: string, format: 'plain' | 'markdown' | undefined): string {
  if (!text.trim()) return '';
  if (format === 'markdown') return md.parse(text) as string;
  return text
    .trim()
    .split(/\n\s*\n/)
    .map((p) => `<p>${escapeHtml(p).replace(/\r?\n/g, '<br>')}</p>`)
    .join('');
}
