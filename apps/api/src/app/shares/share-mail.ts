import { Marked } from 'marked';
import type { User } from '@tallyfit/contracts';

/** What a share e-mail carries: a plain-text part for any reader and an HTML part for mail programs that show it. */
export interface ShareMailBody {
  text: string;
  html: string;
}

const escapeHtml = (text: string) =>
  text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');

/**
 * The report's Markdown as HTML. Titles, labels and notes come from people, so any HTML they hold
 * is shown as text rather than passed through (a mail program would otherwise run it as markup).
 */
const reportMarkdown = new Marked({
  gfm: true,
  async: false,
  renderer: {
    html: ({ text }) => escapeHtml(text),
  },
});

/** Mail programs ignore style sheets in the head unevenly; these few rules keep the tables readable where they are honoured. */
const MAIL_STYLE =
  'body{font-family:Roboto,Arial,sans-serif;color:#1b1b1f;line-height:1.45;max-width:760px}' +
  'table{border-collapse:collapse;margin:8px 0}th,td{border-bottom:1px solid #c7c5d0;padding:4px 10px 4px 0;text-align:left}' +
  'td:not(:first-child),th:not(:first-child){text-align:right}h1{font-size:20px}h2{font-size:16px;margin-top:20px}';

/** The body of a share: who shares what, their note, the link, then the whole report, as text and as HTML. */
export function shareMailBody(sender: Pick<User, 'name'>, title: string, link: string, report: string, message?: string): ShareMailBody {
  const text = [
    `${sender.name} shared the Tallyfit analysis "${title}" with you.`,
    ...(message ? ['', message] : []),
    '',
    `Open it in Tallyfit: ${link}`,
    '',
    'The report follows and is attached as Markdown.',
    '',
    '---',
    '',
    report,
  ].join('\n');
  const html = [
    '<!doctype html><html><head><meta charset="utf-8">',
    `<title>${escapeHtml(title)}</title><style>${MAIL_STYLE}</style></head><body>`,
    `<p>${escapeHtml(sender.name)} shared the Tallyfit analysis “${escapeHtml(title)}” with you.</p>`,
    ...(message ? [`<blockquote>${escapeHtml(message).replace(/\r?\n/g, '<br>')}</blockquote>`] : []),
    `<p><a href="${escapeHtml(link)}">Open it in Tallyfit</a>. The report follows and is attached as Markdown.</p><hr>`,
    reportMarkdown.parse(report) as string,
    '</body></html>',
  ].join('\n');
  return { text, html };
}
