import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Page } from '@playwright/test';
import { closeAppTabs, phoneProfile } from './installedPhone';

/** One line of text, the size of the pad's end heading, and the service worker that keeps it. */
const PAGE = `<!doctype html><meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1, viewport-fit=cover">
<p style="font: bold 24px sans-serif">End 1 of 12: a one-line page kept by a service worker</p>
<script>navigator.serviceWorker.register('/sw.js')</script>`;
const WORKER = `self.addEventListener('install', (e) =>
  e.waitUntil(caches.open('floor').then((c) => c.add('/')).then(() => self.skipWaiting())));
self.addEventListener('activate', (e) => e.waitUntil(self.clients.claim()));
self.addEventListener('fetch', (e) => e.respondWith(caches.match('/')));`;

/**
 * The floor of an offline repeat load on this browser and throttle: a one-line page served by a
 * service worker from its cache, reopened offline in a phone's profile as the pad is (`load`
 * gives each tab its throttle and returns its largest contentful paint).
 */
export async function offlineFloor(
  loads: number,
  load: (page: Page, url: string) => Promise<number>,
): Promise<number[]> {
  const server = createServer((req, res) => {
    const worker = req.url === '/sw.js';
    res.writeHead(200, { 'content-type': worker ? 'text/javascript' : 'text/html' });
    res.end(worker ? WORKER : PAGE);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}/`;
  const phone = await phoneProfile();
  const { context } = phone;
  try {
    const page = await context.newPage();
    await page.goto(url);
    await page.evaluate('navigator.serviceWorker.ready.then(() => new Promise((r) => setTimeout(r, 200)))');
    await page.reload();
    await closeAppTabs(context);
    await context.setOffline(true);
    const lcps: number[] = [];
    for (let i = 0; i < loads; i += 1) lcps.push(await load(await context.newPage(), url));
    return lcps;
  } finally {
    await phone.close();
    server.close();
  }
}
