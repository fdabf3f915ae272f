/**
 * The words of Plyledger's e-mail: a proposal to each quality reviewer and a
 * decision to the proposer, plain text and HTML, each with the link back to
 * the page where the reader acts (the review page, the allowable's page).
 */
import { escapeHtml } from '../shared/escape-html.ts';
import type { OutgoingMessage } from './mail.transport.ts';

export interface AllowableNotice {
  id: number;
  material: string;
  property: string;
  quantity: string;
  condition: string;
  basis: string;
  value: number;
  unit: string;
  revision: number;
  provisional: boolean;
  proposerName: string;
  comment?: string | null;
}

/** Client pages the links open (the client's routes). */
export const reviewPath = (id: number) => `/reviews/${id}`;
export const allowablePath = (id: number) => `/allowables/${id}`;

function describe(a: AllowableNotice): string {
  const value = a.unit === 'MPa' ? `${a.value.toFixed(1)} MPa` : `${(a.value * 1e6).toFixed(0)} microstrain`;
  return `${a.material} ${a.property} ${a.quantity}, ${a.condition}, ${a.basis}-basis: ${value} (revision ${a.revision}${a.provisional ? ', provisional' : ''})`;
}

function html(paragraphs: string[], link: string, linkText: string): string {
  return `<!doctype html><html lang="en"><body style="font-family:sans-serif">${paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`).join('')}` +
    `<p><a href="${escapeHtml(link)}">${escapeHtml(linkText)}</a></p></body></html>`;
}

export function proposalMessage(a: AllowableNotice, to: string, link: string): OutgoingMessage {
  const lines = [
    `${a.proposerName} proposes an allowable for your review:`,
    describe(a),
    ...(a.comment ? [`Comment: ${a.comment}`] : []),
    'Review the analysis, the coupons and the diagnostics, then approve or reject it.',
  ];
  return {
    to,
    subject: `Allowable to review: ${a.material} ${a.property} ${a.condition} ${a.basis}-basis (rev. ${a.revision})`,
    text: `${lines.join('\n\n')}\n\nReview it: ${link}\n`,
    html: html(lines, link, 'Open the review'),
  };
}

export function decisionMessage(a: AllowableNotice, decision: 'approved' | 'rejected', reviewerName: string, decisionComment: string, to: string, link: string): OutgoingMessage {
  const lines = [
    `${reviewerName} ${decision} the allowable you proposed:`,
    describe(a),
    `Comment: ${decisionComment}`,
    ...(decision === 'approved' ? ['Allowables support engineering judgement; they do not replace it.'] : []),
  ];
  return {
    to,
    subject: `Allowable ${decision}: ${a.material} ${a.property} ${a.condition} ${a.basis}-basis (rev. ${a.revision})`,
    text: `${lines.join('\n\n')}\n\nOpen it: ${link}\n`,
    html: html(lines, link, 'Open the allowable'),
  };
}
