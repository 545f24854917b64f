import { build, preview } from 'vite';
import { openBrowser } from '../tests/e2e/browser';
import { benchHeavyInputs } from './heavyInputs.mts';
process.env.NODE_ENV = 'production';
await build({ mode: 'production', logLevel: 'error' });
const server = await preview({ logLevel: 'error', preview: { port: 0 } });
const browser = await openBrowser();
try { const r = await benchHeavyInputs(browser, server.resolvedUrls!.local[0]!); process.stderr.write('RESULT ' + JSON.stringify(r) + '\n'); } finally { await browser.close(); await server.close(); }
