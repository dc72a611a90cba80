import type { RequestHandler } from 'express';
import type { SsrEntry } from '../../../shared/ssr-contract.ts';
import type { AppDeps } from '../../deps.ts';
import { type PreviewCache, ssrData } from './ssr-data.ts';

export type SsrSetup = {
  /** the built client's index.html (its script and stylesheet tags) */
  template: string;
  /** the server-rendering entry, or null when there is none (the plain client shell is sent) */
  entry: () => Promise<SsrEntry | null>;
};

/** The client's index.html with a render put in: head tags, the app's HTML, the query cache. */
export function fillTemplate(template: string, page: { head: string; html: string; state: string }): string {
  return template
    .replace(/<title>[^<]*<\/title>/, '')
    .replace(/<meta name="description"[^>]*>/, '')
    .replace('</head>', `    ${page.head}\n  </head>`)
    .replace('<div id="root"></div>', `<div id="root">${page.html}</div>`)
    .replace('</body>', `  <script type="application/json" id="namesake-ssr-state">${page.state}</script>\n  </body>`);
}

/**
 * Every page that is not an API call or a file: the public pages come server-rendered (status 404
 * for an unknown address or slug), every other page as the client shell. HTML is `no-cache` with
 * an ETag (Express makes it from the body and answers 304 to a matching If-None-Match).
 */
export function ssrPages(deps: AppDeps, setup: SsrSetup): RequestHandler {
  const cache: PreviewCache = new Map();
  const origin = deps.env.baseUrl.replace(/\/$/, '');
  const shell = (res: Parameters<RequestHandler>[1]) => res.type('html').setHeader('Cache-Control', 'no-cache').send(setup.template);
  return async (req, res) => {
    let entry: SsrEntry | null = null;
    try {
      entry = await setup.entry();
    } catch (e) {
      console.error('server rendering is off: the entry did not load', e);
    }
    if (!entry) return void shell(res);
    try {
      const page = await entry.render({ url: origin + req.originalUrl, origin, data: ssrData(deps, req.user, cache) });
      if (!page) return void shell(res);
      res.status(page.status).type('html').setHeader('Cache-Control', 'no-cache');
      res.setHeader('Vary', 'Cookie');
      res.send(fillTemplate(setup.template, page));
    } catch (e) {
      // a page that cannot be rendered here still works in the browser
      console.error(`server render of ${req.originalUrl} failed`, e);
      shell(res);
    }
  };
}
