import { chromium } from '@playwright/test';
import { spawn } from 'node:child_process';
import { writeFileSync } from 'node:fs';
const server = spawn(process.execPath, ['scripts/serve.js', '--port', '4556', '--quiet'], { stdio: 'ignore' });
await new Promise(r => setTimeout(r, 400));
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--no-sandbox','--disable-gpu'] });
const all = [];
for (let i = 0; i < 4; i++) {
const ctx = await browser.newContext({ viewport: { width: 1440, height: 900 } });
const page = await ctx.newPage();
const cdp = await ctx.newCDPSession(page);
await cdp.send('Profiler.enable');
await cdp.send('Profiler.setSamplingInterval', { interval: 50 });
await cdp.send('Profiler.start');
await page.goto('http://localhost:4556' + (process.argv[2] ?? '/'));
await page.waitForTimeout(1500);
const { profile } = await cdp.send('Profiler.stop');
writeFileSync(`/tmp/prof${i}.cpuprofile`, JSON.stringify(profile));
await ctx.close();
}
await browser.close(); server.kill();
