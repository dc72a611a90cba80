// The sellers' morning digest (run by server/jobs/scheduler.ts): one e-mail per shop per calendar day listing the lines that are late,
// due today or at risk. "Once per day" is kept by the job_runs table: the key
// digest:<yyyy-MM-dd>:<shopId> is inserted BEFORE the mail is handed to the mailer, so a second run
// (the cron and the start-up catch-up, two processes, a restart) finds it and sends nothing.

import { SHIP_MARK_LABELS } from '../../../shared/business/marks.ts';
import type { DueLine } from '../../../shared/schemas/business.ts';
import type { AppDeps } from '../../deps.ts';
import { escapeHtml as esc, type Mail, mailLayout } from '../../integrations/mailer.ts';
import { businessRepo } from './business.repo.ts';
import { due, todayOf } from './business.service.ts';

export type DigestDeps = Pick<AppDeps, 'db' | 'env' | 'mailer' | 'now'>;
export type DigestResult = { day: string; sent: string[]; skipped: string[]; empty: string[]; failed: string[] };

export const digestKey = (day: string, shopId: string) => `digest:${day}:${shopId}`;

export function digestMail(to: { email: string; name: string }, shopName: string, day: string, lines: DueLine[], baseUrl: string): Mail {
  const groups = (['late', 'due_today', 'at_risk'] as const).map((m) => ({ mark: m, lines: lines.filter((l) => l.mark === m) })).filter((g) => g.lines.length);
  const late = lines.filter((l) => l.mark === 'late').length;
  const dueToday = lines.filter((l) => l.mark === 'due_today').length;
  const item = (l: DueLine) => `${l.orderNumber} · ${l.quantity} × ${l.listingTitle} · ${l.state.replace(/_/g, ' ')} · ship by ${l.shipBy}`;
  const link = `${baseUrl}/workroom`;
  const title: Record<string, string> = { late: 'Late (past the ship-by date)', due_today: 'Due today', at_risk: 'At risk (not cut, one working day left)' };
  return {
    to: to.email,
    subject: `${shopName}: ${dueToday} due today, ${late} late — your workroom for ${day}`,
    text: [`Good morning ${to.name},`, '', ...groups.flatMap((g) => [`${title[g.mark]}:`, ...g.lines.map((l) => `  - ${item(l)}`), '']), `Open the workroom: ${link}`].join('\n'),
    html: mailLayout(
      `Your workroom for ${day}`,
      `<p>Good morning ${esc(to.name)},</p>` +
        groups
          .map(
            (g) =>
              `<h2 style="font-size:16px;margin:16px 0 6px">${esc(title[g.mark]!)}</h2><ul>${g.lines.map((l) => `<li><strong>${esc(SHIP_MARK_LABELS[l.mark!])}</strong> — ${esc(item(l))}</li>`).join('')}</ul>`,
          )
          .join('') +
        `<p><a href="${esc(link)}" style="display:inline-block;background:#e0a526;color:#1f2a44;font-weight:800;padding:10px 18px;border-radius:8px;text-decoration:none">Open the workroom</a></p>`,
    ),
  };
}

/** Sends today's digest to every shop that has late, due or at-risk lines and has not had it today. */
export async function runDigest(deps: DigestDeps): Promise<DigestResult> {
  const day = todayOf(deps);
  const result: DigestResult = { day, sent: [], skipped: [], empty: [], failed: [] };
  for (const { shop, ownerEmail, ownerName } of businessRepo.shopsWithOwners(deps.db)) {
    const key = digestKey(day, shop.id);
    if (businessRepo.jobRan(deps.db, key)) {
      result.skipped.push(shop.id);
      continue;
    }
    const lines = due(deps, shop, day).lines.filter((l) => l.mark !== null);
    // claimed before sending: if another run claimed it between our check and now, it sends, we don't
    if (!businessRepo.claimJob(deps.db, key, deps.now())) {
      result.skipped.push(shop.id);
      continue;
    }
    if (!lines.length) {
      result.empty.push(shop.id);
      continue;
    }
    try {
      await deps.mailer.send(digestMail({ email: ownerEmail, name: ownerName }, shop.name, day, lines, deps.env.baseUrl));
      result.sent.push(shop.id);
    } catch (e) {
      // the mail did not leave: free the key so the next run (a restart's catch-up) tries again
      businessRepo.releaseJob(deps.db, key);
      result.failed.push(shop.id);
      console.error(`digest: mail to shop ${shop.id} failed`, e);
    }
  }
  return result;
}
