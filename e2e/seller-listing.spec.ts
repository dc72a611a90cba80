// Journey 4 (DEVELOPERS.md, "Journeys"), seller side: a seller builds a listing with a text field and a
// two-layer motif in the editor, sends it for review, and an admin approves it from the desk;
// only then does the catalogue's search find it.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { demo, expect, signIn, test } from './fixtures.ts';

// A tiny layered motif: each colour in its own group, as the upload form asks.
const TWO_LAYER_SVG = `<svg xmlns="http://www.w3.org/2000/svg" width="60mm" height="40mm" viewBox="0 0 60 40">
  <g id="leaf" fill="#3f6b3a"><ellipse cx="30" cy="20" rx="28" ry="16"/></g>
  <g id="vein" fill="#f7f3ea"><rect x="8" y="19" width="44" height="2"/></g>
</svg>`;

function tempFile(name: string, content: string | Buffer): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-e2e-'));
  const file = path.join(dir, name);
  fs.writeFileSync(file, content);
  return file;
}

test('when a seller builds a listing with a name field and a two-layer motif and an admin approves it, then search finds it', async ({ page, browser }) => {
  const title = `Leaf tote for Anouk ${Date.now().toString(36)}`;
  await signIn(page, demo.fern);

  await page.goto('/workroom/listings/new');
  await expect(page.getByRole('heading', { name: 'New listing' })).toBeVisible();

  // a save with nothing filled in is refused field by field, and nothing is sent
  await page.getByRole('button', { name: 'Save draft' }).click();
  await expect(page.getByText('Use at least 3 characters.')).toBeVisible();
  await expect(page.getByText('Enter the base price.')).toBeVisible();
  await expect(page.getByText('Add a text field or a motif for the shopper to personalise.')).toBeVisible();

  await page.getByLabel('Title').fill(title);
  await page.getByLabel('Description', { exact: true }).fill('A natural cotton tote with a pressed leaf and a name.');
  await page.getByLabel('Autumn harvest').check();
  await page.getByLabel('Base price').fill('24.50');

  // a reload loses nothing: the editor keeps a copy in this browser until the listing is saved
  await page.waitForTimeout(600);
  await page.reload();
  await expect(page.getByText('Unsaved changes from this browser were restored.')).toBeVisible();
  await expect(page.getByLabel('Title')).toHaveValue(title);
  await expect(page.getByLabel('Base price')).toHaveValue('24.50');
  await expect(page.getByLabel('Autumn harvest')).toBeChecked();

  // a "photo" that is really HTML is refused with the server's reason
  await page.getByLabel('Add photos').setInputFiles(tempFile('fake.png', '<html><script>alert(1)</script></html>'));
  await expect(page.getByRole('alert').filter({ hasText: 'fake.png: That file is not a JPEG, PNG or WebP image' })).toBeVisible();

  // the text field starts with a name label, the first font and the first colour
  await page.getByRole('button', { name: 'Add a text field' }).click();
  const textField = page.getByRole('group', { name: 'Text field 1' });
  await expect(textField.getByLabel('Label')).toHaveValue('Name');

  // a motif with a DOCTYPE is refused, and the message says why
  await page.getByLabel('Motif name').fill('Bad leaf');
  await page.getByLabel('SVG file').setInputFiles(tempFile('bad.svg', '<!DOCTYPE svg [<!ENTITY x "y">]><svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 1 1"/>'));
  await page.getByRole('button', { name: 'Upload motif' }).click();
  await expect(page.getByRole('alert').filter({ hasText: 'DOCTYPE' })).toBeVisible();

  // the two-layer motif uploads, and its layers are shown as the engine normalised them
  const motifName = `Leaf ${Date.now().toString(36)}`;
  await page.getByLabel('Motif name').fill(motifName);
  await page.getByLabel('SVG file').setInputFiles(tempFile('leaf.svg', TWO_LAYER_SVG));
  await page.getByRole('button', { name: 'Upload motif' }).click();
  await expect(page.getByText(`“${motifName}” uploaded with 2 layers.`)).toBeVisible();

  await page.getByLabel('Offer one of your motifs').selectOption({ label: `${motifName} (2 layers)` });
  const motif = page.getByRole('group', { name: 'Motif 1' });
  await expect(motif.getByRole('img', { name: 'Layer 1: leaf' })).toBeVisible();
  await expect(motif.getByRole('img', { name: 'Layer 2: vein' })).toBeVisible();
  // the bottom layer is always one material; the top one is the shopper's colour choice
  await motif.getByLabel('Always one material').first().check();
  await motif.getByLabel('Material for leaf').selectOption({ index: 1 });

  await page.getByRole('button', { name: 'Save and submit for review' }).click();
  await expect(page.getByText('Saved and sent for review.')).toBeVisible();
  await expect(page).toHaveURL(/\/workroom\/listings\/[^/]+\/edit$/);
  await expect(page.getByText('In review', { exact: true })).toBeVisible();
  const listingId = page.url().split('/').at(-2)!;
  expect(await page.evaluate(() => Object.keys(localStorage).filter((k) => k.startsWith('namesake:listing-draft:')))).toEqual([]);

  const saved = await (await page.request.get(`/api/seller/listings/${listingId}`)).json();
  expect(saved.listing.state).toBe('in_review');
  expect(saved.listing.draft.personalisation.textFields[0].id).toBe('name');
  expect(saved.listing.draft.personalisation.motifChoices[0].layers.map((l: { layerId: string; mode: string }) => [l.layerId, l.mode])).toEqual([
    ['leaf', 'fixed'],
    ['vein', 'shopper'],
  ]);

  // not on sale before the review
  const before = await (await page.request.get(`/api/listings?q=${encodeURIComponent(title)}`)).json();
  expect(before.items.map((i: { id: string }) => i.id)).not.toContain(listingId);

  // the admin reviews it as shoppers would see it, and approves it
  const adminContext = await browser.newContext();
  const admin = await adminContext.newPage();
  await signIn(admin, demo.admin);
  await admin.goto('/moderation');
  await admin.getByRole('link', { name: `Review ${title}` }).click();
  const preview = admin.getByRole('article', { name: 'Listing as shoppers see it' });
  await expect(preview.getByRole('heading', { name: title })).toBeVisible();
  await expect(preview.getByText('$24.50')).toBeVisible();
  await expect(preview.getByRole('img', { name: `Motif: ${motifName}` })).toBeVisible();
  await admin.getByRole('button', { name: 'Approve listing' }).click();
  await expect(admin.getByText(`“${title}” is approved and on sale.`)).toBeVisible();
  await adminContext.close();

  const after = await (await page.request.get(`/api/listings?q=${encodeURIComponent(title)}`)).json();
  expect(after.items.map((i: { id: string }) => i.id)).toContain(listingId);

  // the seller's table shows it live, with a pause action
  await page.goto('/workroom/listings');
  const row = page.getByRole('row').filter({ hasText: title });
  await expect(row.getByText('Live', { exact: true })).toBeVisible();
  await expect(row.getByRole('button', { name: `Pause ${title}` })).toBeVisible();
});
