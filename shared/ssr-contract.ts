/**
 * The seam between the server and the server-rendering entry (src/app/ssr/entry-server.tsx): the
 * server hands the entry the data of the public pages (the same values its JSON routes answer),
 * the entry answers with the HTML parts. Plain types only, so both sides can name them.
 */
import type { ComposeInput } from './engine/compose.ts';
import type { Me } from './schemas/auth.ts';
import type { CatalogPage, CatalogQuery, ListingPage, PublicShop } from './schemas/catalog.ts';

/** A page's data as its JSON route gives it; `null` = that route's 404. */
export type SsrData = {
  me(): Promise<Me | null>;
  listing(slug: string): Promise<ListingPage | null>;
  shop(slug: string): Promise<PublicShop | null>;
  /** throws when the filters are refused (the page then loads them in the browser and shows why) */
  search(filters: Partial<CatalogQuery>): Promise<CatalogPage>;
  /** composes a design (in the worker pool, cached) into pieces placed on the blank */
  compose(input: ComposeInput): Promise<PreviewPieces>;
};

export type SsrRenderInput = {
  /** the request URL, absolute */
  url: string;
  /** the public origin (BASE_URL), for canonical URLs and social cards */
  origin: string;
  data: SsrData;
};

/** null: not a public page, the server answers with the plain client shell. */
export type SsrResult = {
  status: number;
  /** tags for <head>: title, description, canonical, Open Graph, Twitter card, JSON-LD */
  head: string;
  /** the rendered app, for <div id="root"> */
  html: string;
  /** the query cache for the browser, as JSON (already safe to put in a <script> element) */
  state: string;
} | null;

export type PreviewPieces = Array<{ d: string; colourHex: string }>;

/** The name a listing's first picture carries until the shopper types their own. */
export const PREVIEW_NAME = 'Mira';

export type SsrEntry = {
  /** the compose() input of the listing's default choices with PREVIEW_NAME typed (null: nothing to draw) */
  previewInput(listing: ListingPage): ComposeInput | null;
  render(input: SsrRenderInput): Promise<SsrResult>;
  /** the design on its blank as a standalone SVG document (the listing image's source) */
  designSvg(listing: ListingPage, pieces: PreviewPieces): string;
};
