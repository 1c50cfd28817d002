import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { match } from 'path-to-regexp';

/** What is read here of a chunk in Vite's build manifest (`build.manifest`). */
interface ManifestChunk {
  file: string;
  isEntry?: boolean;
  imports?: string[];
  assets?: string[];
}
type Manifest = Record<string, ManifestChunk>;

/**
 * The modules each client route loads before it can draw (see src/app/router.tsx), first match wins.
 * The registry's loader asks for its first rows from a small module of its own before the page's code,
 * and the page draws them before it loads the grid: preloading the grid's 200 kB too would slow the
 * fetching of the main bundle it shares the connections with (measured: about 150 ms later first rows).
 */
const routeModules: readonly (readonly [path: string, modules: readonly string[]])[] = [
  ['/', ['src/app/routes/overview.tsx']],
  ['/registry', ['src/features/registry/api/prefetch-registry.ts', 'src/app/routes/registry.tsx']],
  ['/variants/new', ['src/app/routes/register-variant.tsx']],
  ['/variants/:id', ['src/app/routes/variant.tsx']],
  ['/enzymes', ['src/app/routes/enzymes.tsx']],
  ['/enzymes/new', ['src/app/routes/new-enzyme.tsx']],
  ['/enzymes/:id', ['src/app/routes/enzyme.tsx']],
  ['/campaigns/new', ['src/app/routes/new-campaign.tsx']],
  ['/campaigns/:id', ['src/app/routes/campaign.tsx']],
  ['/review', ['src/app/routes/review.tsx']],
  ['/assays/new', ['src/app/routes/assay-entry.tsx']],
  ['/ph-profiles/new', ['src/app/routes/ph-profile-entry.tsx']],
  ['/landscape', ['src/app/routes/landscape.tsx']],
  ['/imports', ['src/app/routes/imports.tsx']],
  ['/imports/:id', ['src/app/routes/imports.tsx']],
  ['/digests', ['src/app/routes/digests.tsx']],
  ['/admin/outbox', ['src/app/routes/outbox.tsx']],
  ['/admin/users', ['src/app/routes/admin-users.tsx']],
  ['/account/password', ['src/app/routes/change-password.tsx']],
  ['/about', ['src/app/routes/about.tsx']],
  ['/sign-in', ['src/app/routes/sign-in.tsx']],
  ['/invitation', ['src/app/routes/accept-invitation.tsx']],
  ['/forgot-password', ['src/app/routes/forgot-password.tsx']],
  ['/reset-password', ['src/app/routes/reset-password.tsx']],
  ['/unsubscribe', ['src/app/routes/unsubscribe.tsx']],
];

// The Latin subsets of the faces every page sets text in (the fontsource file names carry the subset).
const firstFonts = /-latin-(wght|400|600)-normal-[\w-]+\.woff2$/;

/**
 * The client's page (index.html) as sent for each client route: with `<link rel="modulepreload">` for the
 * route's own chunks and `<link rel="preload">` for its first fonts, named from Vite's build manifest.
 * Without them the browser learns of a route's chunks only once the main bundle has run and the router
 * asks for them, and then fetches them in rounds (a chunk, then the chunks it imports), six at a time
 * over HTTP/1.1; with them everything is on its way while the main bundle is still being fetched. Without
 * a manifest (an older build) the plain page is sent.
 *
 * @param clientDir the built client (dist/client)
 * @returns the page to send for a request path
 */
export function clientPages(clientDir: string): (path: string) => string {
  const page = readFileSync(join(clientDir, 'index.html'), 'utf8');
  const manifestPath = join(clientDir, '.vite', 'manifest.json');
  if (!existsSync(manifestPath)) return () => page;
  const manifest = JSON.parse(readFileSync(manifestPath, 'utf8')) as Manifest;

  const entryKey = Object.keys(manifest).find((key) => manifest[key].isEntry);
  const loadedByEntry = entryKey ? staticClosure(manifest, [entryKey]) : new Set<string>();
  const fonts = (entryKey ? (manifest[entryKey].assets ?? []) : []).filter((file) => firstFonts.test(file));
  const fontLinks = fonts.map((file) => `<link rel="preload" href="/${file}" as="font" type="font/woff2" crossorigin>`);

  const withLinks = (modules: readonly string[]) => {
    const files = [...staticClosure(manifest, modules)].filter((file) => !loadedByEntry.has(file));
    const links = [...fontLinks, ...files.map((file) => `<link rel="modulepreload" href="/${file}">`)];
    return page.replace('</head>', `${links.join('')}</head>`);
  };
  const routes = routeModules.map(([path, modules]) => ({ matches: match(path), html: withLinks(modules) }));
  const otherPage = withLinks([]);
  return (path) => routes.find((route) => route.matches(path))?.html ?? otherPage;
}

/** The files of the named chunks and of every chunk they import statically, in load order. */
function staticClosure(manifest: Manifest, keys: readonly string[]): Set<string> {
  const files = new Set<string>();
  const visited = new Set<string>();
  const visit = (key: string) => {
    const chunk = manifest[key];
    if (!chunk || visited.has(key)) return;
    visited.add(key);
    files.add(chunk.file);
    chunk.imports?.forEach(visit);
  };
  keys.forEach(visit);
  return files;
}
