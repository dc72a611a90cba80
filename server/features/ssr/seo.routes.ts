import { Router } from 'express';
import type { AppDeps } from '../../deps.ts';
import { liveListingSlugs, liveShopSlugs } from './seo.repo.ts';

const xmlEscape = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&apos;');
const day = (ms: number) => new Date(ms).toISOString().slice(0, 10);

/**
 * GET /robots.txt (names the sitemap) and GET /sitemap.xml: the home page, the search page, every
 * live listing and every live shop, read from the database on each request so it follows every
 * approval, pause and suspension at once (https://www.sitemaps.org/protocol.html).
 */
export function seoRouter(deps: AppDeps): Router {
  const r = Router();
  const origin = deps.env.baseUrl.replace(/\/$/, '');
  r.get('/robots.txt', (_req, res) => {
    res.type('text/plain').setHeader('Cache-Control', 'public, max-age=3600');
    res.send(
      [
        'User-agent: *',
        'Disallow: /api/',
        'Disallow: /workroom',
        'Disallow: /moderation',
        'Disallow: /business',
        'Disallow: /cart',
        'Disallow: /orders',
        '',
        `Sitemap: ${origin}/sitemap.xml`,
        '',
      ].join('\n'),
    );
  });
  r.get('/sitemap.xml', (_req, res) => {
    const urls: string[] = [`${origin}/`, `${origin}/search`].map((loc) => `<url><loc>${xmlEscape(loc)}</loc></url>`);
    for (const l of liveListingSlugs(deps.db)) urls.push(`<url><loc>${xmlEscape(`${origin}/listings/${encodeURIComponent(l.slug)}`)}</loc><lastmod>${day(l.updatedAt)}</lastmod></url>`);
    for (const s of liveShopSlugs(deps.db)) {
      const lastmod = s.updatedAt ? `<lastmod>${day(s.updatedAt)}</lastmod>` : '';
      urls.push(`<url><loc>${xmlEscape(`${origin}/shops/${encodeURIComponent(s.slug)}`)}</loc>${lastmod}</url>`);
    }
    res.type('application/xml').setHeader('Cache-Control', 'no-cache');
    res.send(`<?xml version="1.0" encoding="UTF-8"?>\n<urlset xmlns="http://www.sitemaps.org/schemas/sitemap/0.9">\n${urls.join('\n')}\n</urlset>\n`);
  });
  return r;
}
