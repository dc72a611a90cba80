// The press run on a 768 px tablet, keyboard only: two cut items from the press queue, every step
// started with the space bar, timers run to their end on the page's clock (no waiting), the first
// item marked pressed online, the second offline — kept on the device and synced when the
// connection is back.
import fs from 'node:fs';
import path from 'node:path';
import type { Page } from '@playwright/test';
import { apiGet, apiPost, signInApi } from './api-helpers.ts';
import { demo, expect, test } from './fixtures.ts';

const SHOTS = process.env.PRESS_RUN_SHOTS ?? path.join(process.cwd(), 'test-results', 'press-run');

type Line = { id: string; state: string; text: string; orderNumber: string };

/** Runs every step of the item on screen with the keyboard; returns when its last step is done. */
async function runItem(page: Page, shot?: string) {
  for (let guard = 0; guard < 30; guard++) {
    const pos = (await page.getByText(/step \d+ of \d+/).textContent()) ?? '';
    const [, n, m] = pos.match(/step (\d+) of (\d+)/)!;
    const countdown = page.getByTestId('countdown');
    if (await countdown.isVisible()) {
      const secs = Number((await countdown.textContent())!.match(/\d+/)![0]);
      await page.keyboard.press('Space');
      await expect(page.getByRole('button', { name: 'Done early' })).toBeFocused();
      if (shot && n === '1') await page.screenshot({ path: path.join(SHOTS, `${shot}-timer.png`), fullPage: true });
      await page.clock.runFor(secs * 1000 + 400);
    } else {
      await page.keyboard.press('Space');
    }
    if (n === m) return;
    await expect(page.getByText(new RegExp(`step ${Number(n) + 1} of ${m}`))).toBeVisible();
  }
  throw new Error('the item never ended');
}

test('the press run at 768 px, keyboard only: steps from the card, timers, pressed online and offline', async ({ page, context }) => {
  fs.mkdirSync(SHOTS, { recursive: true });
  await page.setViewportSize({ width: 768, height: 1024 });
  await signInApi(page, demo.fern);
  // two approved lines through cut sheets to `cut`, as the workroom does it
  const approved = (await apiGet<{ items: Line[] }>(page, '/api/workroom/lines?state=approved&limit=100')).items;
  const chosen = approved.slice(0, 2);
  expect(chosen).toHaveLength(2);
  const built = await apiPost<{ batchId: string }>(page, '/api/workroom/cut-sheets', { lineIds: chosen.map((l) => l.id) });
  await apiPost(page, `/api/workroom/batches/${built.batchId}/cut`, {});
  const queue = (await apiGet<{ cards: Array<{ line: Line }> }>(page, '/api/workroom/press-cards')).cards.map((c) => c.line);
  expect(queue.length).toBeGreaterThanOrEqual(2);

  await page.clock.install();
  await page.goto('/workroom/press/run');
  await expect(page.getByRole('heading', { level: 1 })).toContainText('Press run');
  const first = queue[0]!;
  await expect(page.getByRole('heading', { level: 1 })).toContainText(first.orderNumber);
  // the first step is the pre-press, its big control has the focus, the cautions and placement show
  await expect(page.getByRole('heading', { level: 2 })).toHaveText(/^Pre-press \d+ s$/);
  await expect(page.getByRole('button', { name: /^Start \d+ s$/ })).toBeFocused();
  await expect(page.getByRole('note')).toContainText('Heat burns');
  await expect(page.getByText(/Centre the design horizontally/)).toBeVisible();
  await page.screenshot({ path: path.join(SHOTS, 'press-run-768-start.png'), fullPage: true });
  // nothing on the page is wider than the tablet
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(768);

  await runItem(page, 'press-run-768');
  await expect(
    page
      .getByText(`${first.orderNumber} · ${first.text}`)
      .and(page.getByText(/pressed\./))
      .first(),
  ).toBeVisible();
  const states = async () => new Map((await apiGet<{ items: Line[] }>(page, '/api/workroom/lines?limit=100')).items.map((l) => [l.id, l.state]));
  expect((await states()).get(first.id)).toBe('pressed');

  // the next item opens; the connection drops while it is pressed
  const second = queue[1]!;
  await expect(page.getByRole('heading', { level: 1 })).toContainText(second.orderNumber);
  await page.screenshot({ path: path.join(SHOTS, 'press-run-768-next.png'), fullPage: true });
  await context.setOffline(true);
  await runItem(page);
  await expect(page.getByRole('status').filter({ hasText: 'Offline: 1 mark waiting' })).toBeVisible();
  await page.screenshot({ path: path.join(SHOTS, 'press-run-768-offline.png'), fullPage: true });
  await context.setOffline(false);
  await expect(page.getByRole('status').filter({ hasText: /mark.* waiting/ })).toHaveCount(0);
  expect((await states()).get(second.id)).toBe('pressed');
});
