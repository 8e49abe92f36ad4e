import type { PlanAction } from '@millrace/contracts';
import type { OutgoingMail } from '../mail/outbox.repository';

export interface MailPlan {
  id: number;
  name: string;
  firstWeek: string;
  lastWeek: string;
}

export interface MailEvent {
  action: PlanAction;
  plan: MailPlan;
  actorName: string;
  comment: string | null;
  publicUrl: string;
  /** release only: the readers' assigned work centers (empty or absent: they see every work center) */
  workCenters?: ReadonlyArray<{ code: string; name: string }>;
}

/** Where each e-mail's link points in the planner. */
export const mailLinks = {
  review: (base: string, id: number) => `${base}/plans/${id}/review`,
  plan: (base: string, id: number) => `${base}/plans/${id}`,
  shiftSheets: (base: string, id: number) => `${base}/shift-sheets?plan=${id}`,
};

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/**
 * The e-mail a sign-off step sends, in our own words: plain text and HTML with the same content
 * and one link. Recipients are chosen by the caller (supervisors, the submitting planner, floor leads).
 */
export function signOffMail(event: MailEvent, to: string[]): OutgoingMail {
  const { plan, actorName, comment } = event;
  const weeks = `weeks starting ${plan.firstWeek} to ${plan.lastWeek}`;
  const content = (() => {
    switch (event.action) {
      case 'submit':
        return {
          subject: `Plan "${plan.name}" is waiting for your sign-off`,
          lines: [`${actorName} submitted plan version ${plan.id}, "${plan.name}" (${weeks}), for sign-off.`, 'Please review the changes and approve it or send it back with a comment.'],
          linkText: 'Review the plan',
          link: mailLinks.review(event.publicUrl, plan.id),
        };
      case 'approve':
        return {
          subject: `Plan "${plan.name}" was approved`,
          lines: [`${actorName} approved plan version ${plan.id}, "${plan.name}" (${weeks}).`, 'It can now be released to the floor.'],
          linkText: 'Open the plan',
          link: mailLinks.plan(event.publicUrl, plan.id),
        };
      case 'return':
        return {
          subject: `Plan "${plan.name}" came back with a comment`,
          lines: [`${actorName} sent plan version ${plan.id}, "${plan.name}" (${weeks}), back to you.`, 'Adjust it and submit it again when it is ready.'],
          linkText: 'Open the plan',
          link: mailLinks.plan(event.publicUrl, plan.id),
        };
      case 'release': {
        const centers = event.workCenters ?? [];
        const ready =
          centers.length === 0
            ? 'Your shift sheets for these weeks are ready to print.'
            : `Your shift sheets for these weeks are ready to print, for ${centers.length === 1 ? 'your work center' : 'your work centers'} ${centers.map((w) => `${w.code} (${w.name})`).join(', ')}.`;
        return {
          subject: `New shift sheets: plan "${plan.name}" is released`,
          lines: [`${actorName} released plan version ${plan.id}, "${plan.name}" (${weeks}).`, ready],
          linkText: 'Open your shift sheets',
          link: mailLinks.shiftSheets(event.publicUrl, plan.id),
        };
      }
    }
  })();
  const commentText = comment ? `Comment from ${actorName}: "${comment}"` : null;
  const textLines = [...content.lines, ...(commentText ? ['', commentText] : []), '', `${content.linkText}: ${content.link}`, '', '— Millrace'];
  const html = [
    ...content.lines.map((l) => `<p>${escapeHtml(l)}</p>`),
    ...(commentText ? [`<blockquote>${escapeHtml(commentText)}</blockquote>`] : []),
    `<p><a href="${escapeHtml(content.link)}">${escapeHtml(content.linkText)}</a></p>`,
    '<p>— Millrace</p>',
  ].join('\n');
  return { to, subject: content.subject, text: textLines.join('\n'), html, event: `plan.${event.action}`, planId: plan.id };
}
