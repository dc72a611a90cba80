// Issue 15: a batch built with "keep each order together" shows each order inside a labelled weeding
// border, says what the grouping costs in roll length, and each order line links to its 1:1 template.
import { demo, expect, signIn, test } from './fixtures.ts';

test('a seller keeps each order together on the cut sheets and opens a placement template', async ({ page }, info) => {
  test.setTimeout(120_000);
  await signIn(page, demo.fern);
  await page.goto('/workroom/cut-sheets');
  await expect(page.getByRole('heading', { name: 'Approved lines, ready to cut' })).toBeVisible();
  await page.getByRole('radio', { name: /Keep each order together/ }).check();
  await page.getByRole('checkbox', { name: /weeding lines between the orders/ }).check();
  await page.getByRole('button', { name: /Build cut sheets for/ }).click();
  await expect(page.getByTestId('grouping-cost')).toContainText(/than the tightest nest/);
  const sheet = page.getByTestId('cut-sheet').first();
  await expect(sheet.getByText('Order groups')).toBeVisible();
  // the on-screen sheet is the SVG: its borders are cuts and its labels a separate non-cut group
  const src = (await sheet.getByRole('img').getAttribute('src'))!;
  const svg = await (await page.request.get(src)).text();
  expect(svg).toMatch(/<g id="order-labels" data-cut="no"/);
  expect(svg).toMatch(/data-group="NS-/);
  await page.screenshot({ path: info.outputPath('cut-sheet-order-groups.png'), fullPage: true });
  const batchUrl = page.url();
  await sheet.getByRole('img').screenshot({ path: info.outputPath('cut-sheet-order-groups-sheet.png') });

  // an order's line links to its template (a PDF)
  const order = /NS-\d+/.exec(svg)![0];
  await page.goto('/workroom');
  await page.getByRole('link', { name: order }).first().click();
  const link = page.getByTestId('placement-template').first().getByRole('link', { name: 'A4' });
  const res = await page.request.get((await link.getAttribute('href'))!);
  expect(res.headers()['content-type']).toBe('application/pdf');
  const fs = await import('node:fs');
  fs.writeFileSync(info.outputPath('placement-template.pdf'), await res.body());

  // nothing was cut: discarding the batch gives its lines back to the queue (the specs after this one need them)
  await page.goto(batchUrl);
  await page.getByRole('button', { name: 'Discard this batch' }).click();
  await expect(page.getByText(/Batch discarded; \d+ lines are approved/)).toBeVisible();
});
