// The fake's hosted payment pages: plain HTML forms, no script, Namesake's own simple look.

const ZERO_DECIMAL = new Set(['bif', 'clp', 'djf', 'gnf', 'jpy', 'kmf', 'krw', 'mga', 'pyg', 'rwf', 'ugx', 'vnd', 'vuv', 'xaf', 'xof', 'xpf']);
const THREE_DECIMAL = new Set(['bhd', 'jod', 'kwd', 'omr', 'tnd']);

/** Minor units per ISO 4217 Table A.1 (USD 2, JPY 0, KWD 3), as Stripe's "Currencies" page lists. */
export function minorDigits(currency: string): number {
  const c = currency.toLowerCase();
  if (ZERO_DECIMAL.has(c)) return 0;
  if (THREE_DECIMAL.has(c)) return 3;
  return 2;
}

export function formatMinor(amount: number, currency: string): string {
  const d = minorDigits(currency);
  return new Intl.NumberFormat('en', {
    style: 'currency',
    currency: currency.toUpperCase(),
    minimumFractionDigits: d,
    maximumFractionDigits: d,
  }).format(amount / 10 ** d);
}

export function esc(s: unknown): string {
  return String(s ?? '')
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

const STYLE = `
:root { color-scheme: light; }
* { box-sizing: border-box; }
body { margin: 0; background: #fbf7f0; color: #1f2a44; font: 16px/1.5 system-ui, -apple-system, "Segoe UI", sans-serif; }
main { max-width: 30rem; margin: 2rem auto; padding: 1.5rem; background: #fffdf9; border: 1px solid #d9cfbf; border-radius: 12px; }
h1 { font-size: 1.5rem; margin: 0 0 .5rem; }
.test { background: #1f2a44; color: #fbf7f0; padding: .4rem .75rem; border-radius: 6px; font-weight: 600; margin: 0 0 1rem; }
.amount { font-size: 2rem; font-weight: 700; margin: .25rem 0 1rem; }
ul.items { padding: 0; list-style: none; margin: 0 0 1rem; }
ul.items li { display: flex; justify-content: space-between; gap: 1rem; border-bottom: 1px solid #eadfcd; padding: .35rem 0; }
label { display: block; font-weight: 600; margin: .75rem 0 .25rem; }
.hint { font-size: .875rem; margin: 0 0 .25rem; }
input { width: 100%; font: inherit; color: #1f2a44; padding: .6rem .7rem; border: 2px solid #6b6f7d; border-radius: 8px; background: #fff; min-height: 44px; }
input[aria-invalid="true"], select[aria-invalid="true"] { border-color: #a3261b; }
select { width: 100%; font: inherit; color: #1f2a44; padding: .6rem .7rem; border: 2px solid #6b6f7d; border-radius: 8px; background: #fff; min-height: 44px; }
fieldset { border: 1px solid #d9cfbf; border-radius: 8px; margin: 1rem 0 0; padding: .25rem 1rem 1rem; }
legend { font-weight: 700; padding: 0 .25rem; }
.row { display: flex; gap: 1rem; } .row > div { flex: 1; }
button { font: inherit; font-weight: 700; background: #e0a526; color: #1f2a44; border: 2px solid #1f2a44; border-radius: 8px; padding: .7rem 1.2rem; min-height: 44px; min-width: 44px; cursor: pointer; margin-top: 1.25rem; }
button.secondary { background: #fffdf9; }
button:focus-visible, input:focus-visible, select:focus-visible, a:focus-visible { outline: 3px solid #1f2a44; outline-offset: 2px; }
.error { border: 2px solid #a3261b; background: #fdeceb; color: #5c130d; padding: .75rem; border-radius: 8px; margin: 1rem 0; }
.field-error { color: #8a1f16; font-size: .875rem; margin: .25rem 0 0; }
a { color: #1f2a44; }
details { margin-top: 1.25rem; font-size: .875rem; }
.actions { display: flex; gap: 1rem; flex-wrap: wrap; align-items: center; margin-top: 1.25rem; }
.actions button { margin-top: 0; }
`;

function page(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${esc(title)}</title>
<style>${STYLE}</style>
</head>
<body>
<main>
<h1>Namesake test payment</h1>
<p class="test">Test mode: no real money moves</p>
${body}
</main>
</body>
</html>`;
}

export interface PageItem {
  name: string;
  quantity: number;
  amount: number;
}

export interface PayPageInput {
  sessionId: string;
  action: string; // form action URL
  amount: number;
  currency: string;
  items: PageItem[];
  email: string | null;
  cancelUrl: string | null;
  /** Set when the session has `shipping_address_collection`: the page then asks for the address too. */
  shippingCountries?: string[] | null;
  error?: string | null;
  fieldErrors?: Partial<Record<CardField | ShippingField, string>>;
  values?: { card_number?: string; card_expiry?: string } & Partial<Record<ShippingField, string>>;
}

export type CardField = 'card_number' | 'card_expiry' | 'card_cvc';
export type ShippingField = 'ship_name' | 'ship_line1' | 'ship_line2' | 'ship_city' | 'ship_postal_code' | 'ship_state' | 'ship_country';

function amountBlock(amount: number, currency: string, items: PageItem[]): string {
  const list = items.map((i) => `<li><span>${esc(i.name)} × ${i.quantity}</span><span>${esc(formatMinor(i.amount, currency))}</span></li>`).join('');
  return `<p>Amount to pay</p>
<p class="amount" data-testid="amount">${esc(formatMinor(amount, currency))}</p>
${items.length ? `<ul class="items" aria-label="What you are paying for">${list}</ul>` : ''}`;
}

function cancelLink(url: string | null, text = 'Back to the shop'): string {
  return url ? `<a href="${esc(url)}">${esc(text)}</a>` : '';
}

function field(name: CardField, label: string, hint: string, autocomplete: string, input: PayPageInput, value = ''): string {
  const err = input.fieldErrors?.[name];
  const hintId = `${name}-hint`;
  const errId = `${name}-error`;
  const describedBy = err ? `${hintId} ${errId}` : hintId;
  return `<label for="${name}">${esc(label)}</label>
<p class="hint" id="${hintId}">${esc(hint)}</p>
<input id="${name}" name="${name}" inputmode="${name === 'card_expiry' ? 'text' : 'numeric'}" autocomplete="${autocomplete}" required value="${esc(value)}"
  aria-describedby="${describedBy}"${err ? ' aria-invalid="true"' : ''}>
${err ? `<p class="field-error" id="${errId}">${esc(err)}</p>` : ''}`;
}

function describe(name: ShippingField, hint: string | null, input: PayPageInput): { attrs: string; after: string; before: string } {
  const err = input.fieldErrors?.[name];
  const ids = [hint ? `${name}-hint` : null, err ? `${name}-error` : null].filter(Boolean).join(' ');
  return {
    before: hint ? `<p class="hint" id="${name}-hint">${esc(hint)}</p>` : '',
    attrs: `${ids ? ` aria-describedby="${ids}"` : ''}${err ? ' aria-invalid="true"' : ''}`,
    after: err ? `<p class="field-error" id="${name}-error">${esc(err)}</p>` : '',
  };
}

function textField(name: ShippingField, label: string, autocomplete: string, required: boolean, input: PayPageInput, hint: string | null = null): string {
  const d = describe(name, hint, input);
  return `<label for="${name}">${esc(label)}</label>
${d.before}<input id="${name}" name="${name}" autocomplete="${autocomplete}"${required ? ' required' : ''} value="${esc(input.values?.[name] ?? '')}"${d.attrs}>
${d.after}`;
}

function countryName(code: string): string {
  try {
    return new Intl.DisplayNames(['en'], { type: 'region' }).of(code) ?? code;
  } catch {
    return code;
  }
}

function shippingBlock(countries: string[], input: PayPageInput): string {
  const chosen = input.values?.ship_country ?? (countries.length === 1 ? countries[0] : '');
  const options = countries
    .map((c) => ({ c, name: countryName(c) }))
    .sort((a, b) => a.name.localeCompare(b.name, 'en'))
    .map(({ c, name }) => `<option value="${esc(c)}"${c === chosen ? ' selected' : ''}>${esc(name)}</option>`)
    .join('');
  const d = describe('ship_country', null, input);
  return `<fieldset>
<legend>Where should the parcel go?</legend>
${textField('ship_name', 'Full name', 'shipping name', true, input)}
${textField('ship_line1', 'Address line 1', 'shipping address-line1', true, input, 'House number and street')}
${textField('ship_line2', 'Address line 2 (optional)', 'shipping address-line2', false, input, 'Flat, unit or building')}
${textField('ship_city', 'Town or city', 'shipping address-level2', true, input)}
<div class="row">
<div>${textField('ship_postal_code', 'Postal code', 'shipping postal-code', true, input)}</div>
<div>${textField('ship_state', 'State or county (optional)', 'shipping address-level1', false, input)}</div>
</div>
<label for="ship_country">Country</label>
<select id="ship_country" name="ship_country" autocomplete="shipping country" required${d.attrs}>
<option value=""${chosen ? '' : ' selected'}>Choose a country</option>
${options}
</select>
${d.after}
</fieldset>`;
}

export function payPage(input: PayPageInput): string {
  const items = input.items;
  const error = input.error ? `<div class="error" role="alert"><p>${esc(input.error)}</p>${input.cancelUrl ? `<p>${cancelLink(input.cancelUrl, 'Go back to your cart')}</p>` : ''}</div>` : '';
  return page(
    'Namesake test payment',
    `${amountBlock(input.amount, input.currency, items)}
${input.email ? `<p>Receipt to ${esc(input.email)}</p>` : ''}
${error}
<form method="post" action="${esc(input.action)}" novalidate>
${input.shippingCountries?.length ? shippingBlock(input.shippingCountries, input) : ''}
${field('card_number', 'Card number', '16 digits, as printed on the card', 'cc-number', input, input.values?.card_number ?? '')}
<div class="row">
<div>${field('card_expiry', 'Expiry date (MM/YY)', 'For example 12/34', 'cc-exp', input, input.values?.card_expiry ?? '')}</div>
<div>${field('card_cvc', 'Security code (CVC)', '3 or 4 digits', 'cc-csc', input)}</div>
</div>
<div class="actions">
<button type="submit">Pay ${esc(formatMinor(input.amount, input.currency))}</button>
${cancelLink(input.cancelUrl)}
</div>
</form>
<details>
<summary>Test card numbers</summary>
<ul>
<li>4242 4242 4242 4242: payment succeeds</li>
<li>4000 0000 0000 0002: card declined</li>
<li>4000 0000 0000 9995: declined for insufficient funds</li>
<li>4000 0027 6000 3184: asks for an extra confirmation step</li>
</ul>
<p>Any future expiry date and any 3 digits for the security code.</p>
</details>`,
  );
}

export function authPage(input: { action: string; amount: number; currency: string; cancelUrl: string | null }): string {
  return page(
    'Confirm your payment – Namesake test payment',
    `<h2>Your card asks for an extra confirmation</h2>
<p>This stands in for the check your bank would show. Choose what the bank should answer.</p>
${amountBlock(input.amount, input.currency, [])}
<div class="actions">
<form method="post" action="${esc(input.action)}"><input type="hidden" name="result" value="complete"><button type="submit">Complete authentication</button></form>
<form method="post" action="${esc(input.action)}"><input type="hidden" name="result" value="fail"><button type="submit" class="secondary">Fail authentication</button></form>
</div>
${input.cancelUrl ? `<p>${cancelLink(input.cancelUrl, 'Go back to your cart')}</p>` : ''}`,
  );
}

export function messagePage(title: string, message: string, link?: { href: string; text: string } | null): string {
  return page(
    `${title} – Namesake test payment`,
    `<h2>${esc(title)}</h2>
<p role="status">${esc(message)}</p>
${link ? `<p><a href="${esc(link.href)}">${esc(link.text)}</a></p>` : ''}`,
  );
}
