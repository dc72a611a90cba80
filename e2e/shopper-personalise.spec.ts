// Journey 1, the shopper's half: find a live demo listing by search, personalise it with the live
// preview (size, a named warning for a character the font lacks, colours, price), add it to the
// cart, and find the typed name still there after a reload. Then the same with the keyboard only.
import type { Page } from '@playwright/test';
import { ensureLiveDemoListing } from '../bench/preview.ts';
import { expect, test } from './fixtures.ts';

type FontInfo = { id: string; family: string; characters: string };
type Listing = {
  id: string;
  content: { title: string; personalisation: { textFields: { id: string; label: string; maxLength: number; defaultFontId: string; fontIds: string[]; colourChoices: string[] }[] } };
  materials: { id: string; colourName: string }[];
};

// candidates from Latin Extended-B, Greek, Cyrillic and CJK: the display fonts cover Latin-1 and
// Extended-A (shared/engine/font-catalog.ts), so one of these is missing from any of them
const CANDIDATES = ['ǅ', 'Ș', 'ƒ', 'Ω', 'Ж', 'א', '美'];

async function setup(page: Page) {
  const base = test.info().project.use.baseURL!;
  const summary = await ensureLiveDemoListing(base);
  const listing = (await (await page.request.get(`/api/listings/${summary.slug}`)).json()) as Listing;
  const fonts = (await (await page.request.get('/api/fonts')).json()) as FontInfo[];
  const field = listing.content.personalisation.textFields[0];
  if (!field) throw new Error(`The demo listing ${summary.slug} has no name field to type into.`);
  return { summary, listing, fonts, field };
}

const nameInput = (page: Page, label: string) => page.getByRole('textbox', { name: new RegExp(`^${label}`) });

test('a shopper finds a listing by search, personalises it with the live preview and adds it to the cart', async ({ page }) => {
  const { summary, listing, fonts, field } = await setup(page);

  // search by a word of the title
  await page.goto('/search');
  const word = summary.title.split(/\s+/).find((w) => w.length > 3)!;
  await page.getByRole('searchbox', { name: 'Search' }).fill(word);
  await page.getByRole('button', { name: 'Search', exact: true }).click();
  await expect(page).toHaveURL(new RegExp(`q=${word}`));
  await page.getByRole('link', { name: summary.title }).click();
  await expect(page.getByRole('heading', { level: 1, name: summary.title })).toBeVisible();
  await expect(page.getByText('Care card')).toBeVisible();

  // type the name: the preview draws it and gives its size in cm and in
  const input = nameInput(page, field.label);
  await input.fill('');
  await input.pressSequentially('Zoë');
  const size = page.getByTestId('design-size');
  await expect(size).toContainText(/\d+\.\d × \d+\.\d cm \(\d+\.\d × \d+\.\d in\)/);
  const preview = page.getByTestId('design-preview');
  await expect(preview).toHaveAttribute('aria-label', /Zoë/);
  expect(await preview.locator('path[transform]').count()).toBeGreaterThan(0);
  // weeding is the maker's word: the shopper hears only what fine detail means for them
  await expect(page.getByText(/counters? to pick out|Weeding:/)).toHaveCount(0);

  // a character this font lacks (from its cmap, GET /api/fonts `characters`) is named back
  const font = fonts.find((f) => f.id === field.defaultFontId)!;
  const lacking = CANDIDATES.find((c) => !font.characters.includes(c))!;
  expect(lacking).toBeTruthy();
  await input.press('End');
  await input.pressSequentially(lacking);
  const warning = page.locator('[data-warning="missing_characters"]');
  await expect(warning).toContainText(`“${lacking}”`);
  await expect(warning).toContainText(`U+${lacking.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}`);
  await input.press('Backspace');
  await expect(warning).toHaveCount(0);

  // pick another colour for the name; the price stays in view
  const other = listing.materials.find((m) => m.id === field.colourChoices.at(-1))!;
  const colourGroup = page.getByRole('group', { name: `${field.label} colour` });
  await colourGroup.getByText(other.colourName, { exact: true }).click();
  await expect(colourGroup.getByRole('radio', { name: new RegExp(other.colourName) })).toBeChecked();
  await expect(page.getByTestId('price')).toContainText(/\$\d+\.\d\d/);

  // a name over the limit: Add to cart waits and says why, and nothing typed is lost
  const tooLong = 'Bartholomew'.repeat(4).slice(0, field.maxLength + 1);
  await input.fill(tooLong);
  await expect(page.getByRole('button', { name: /Add to cart/ })).toBeDisabled();
  await expect(page.getByTestId('add-blocker')).toContainText(`Use at most ${field.maxLength} characters.`);
  await expect(input).toHaveValue(tooLong);
  await expect(input).toHaveAttribute('aria-invalid', 'true');
  await input.fill('Zoë');

  // add to cart: a confirmation with a link to the cart, and the line holds the choices
  await page.getByRole('button', { name: /Add to cart/ }).click();
  await expect(page.getByTestId('added-to-cart')).toContainText('Added to your cart');
  await expect(page.getByRole('link', { name: 'Go to your cart' })).toHaveAttribute('href', '/cart');
  const cart = await (await page.request.get('/api/cart')).json();
  const line = cart.shops.flatMap((s: { lines: unknown[] }) => s.lines).find((l: { listingId: string }) => l.listingId === listing.id);
  expect(line.snapshot.choices.texts[field.id]?.text).toBe('Zoë');
  expect(line.snapshot.choices.textColours[field.id]).toBe(other.id);

  // what was typed survives a reload
  await page.reload();
  await expect(nameInput(page, field.label)).toHaveValue('Zoë');
  await expect(page.getByRole('group', { name: `${field.label} colour` }).getByRole('radio', { name: new RegExp(other.colourName) })).toBeChecked();
});

test('the personaliser works with the keyboard alone', async ({ page }) => {
  const { summary, field } = await setup(page);
  await page.goto(`/listings/${summary.slug}`);
  const input = nameInput(page, field.label);
  await expect(input).toBeVisible();
  await input.fill('');

  // Tab from the top of the page to the name field
  await page.locator('body').click({ position: { x: 1, y: 1 } });
  for (let i = 0; i < 60 && !(await input.evaluate((el) => el === document.activeElement)); i++) await page.keyboard.press('Tab');
  await expect(input).toBeFocused();
  await page.keyboard.type('Kai');
  await expect(page.getByTestId('design-size')).toContainText('cm');

  // Tab through the rest: every control is reached, radios move with the arrow keys
  const fontGroup = page.getByRole('group', { name: /^Font for the/ });
  const colourGroup = page.getByRole('group', { name: `${field.label} colour` });
  const seen: string[] = [];
  for (let i = 0; i < 40; i++) {
    await page.keyboard.press('Tab');
    const info = await page.evaluate(() => {
      const el = document.activeElement as HTMLInputElement | null;
      const label = el?.closest('label');
      return { tag: el?.tagName, type: el?.type, text: (el?.textContent ?? '').trim(), outline: label ? getComputedStyle(label).outlineStyle : el ? getComputedStyle(el).outlineStyle : '' };
    });
    if (info.type === 'radio') expect(info.outline, 'a focused swatch shows a focus ring').not.toBe('none');
    seen.push(`${info.tag}:${info.type}`);
    if (info.tag === 'BUTTON' && /Add to cart/.test(info.text)) break;
    if (info.type === 'radio' && (await fontGroup.count()) && (await fontGroup.locator('input:focus').count())) {
      const before = await fontGroup.locator('input:checked').getAttribute('value');
      await page.keyboard.press('ArrowRight');
      expect(await fontGroup.locator('input:checked').getAttribute('value')).not.toBe(before);
    } else if (info.type === 'radio' && (await colourGroup.locator('input:focus').count())) {
      const before = await colourGroup.locator('input:checked').getAttribute('value');
      await page.keyboard.press('ArrowRight');
      expect(await colourGroup.locator('input:checked').getAttribute('value')).not.toBe(before);
    } else if (info.type === 'range') {
      await page.keyboard.press('ArrowRight');
    }
  }
  expect(seen).toContain('INPUT:range');
  expect(seen.filter((s) => s === 'INPUT:radio').length).toBeGreaterThanOrEqual(2);
  await expect(page.getByRole('button', { name: /Add to cart/ })).toBeFocused();
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('added-to-cart')).toContainText('Added to your cart');
  await expect(page.getByRole('link', { name: 'Go to your cart' })).toBeVisible();
});
