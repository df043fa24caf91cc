import { chromium } from '@playwright/test';
const b = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--no-sandbox','--disable-gpu'] });
const p = await b.newPage({ viewport: { width: 1440, height: 1000 } });
p.on('pageerror', e => console.log('err', e.message));
await p.goto('http://localhost:4318/'); await p.evaluate(() => localStorage.clear()); await p.goto('http://localhost:4318/');
await p.getByRole('button', { name: 'New' }).click();
const kinds = await p.getByTestId('add-kind').locator('option').evaluateAll(os => os.map(o => o.value));
for (const k of kinds) { await p.getByTestId('add-kind').selectOption(k); await p.getByTestId('add-element').click(); }
await p.getByTestId('src-x-kind').selectOption('divergence');
await p.waitForTimeout(300);
const txt = await p.locator('main').innerText();
console.log('NaN?', /NaN|undefined|Infinity/.test(txt.replace(/"[^"]*"/g,'')));
console.log(await p.getByTestId('setup-error').count() ? await p.getByTestId('setup-error').innerText() : 'no error');
const w = await p.getByTestId('warnings').count() ? await p.getByTestId('warnings').innerText() : 'no warnings'; console.log(w);
await p.screenshot({ path: '/tmp/allkinds.png', fullPage: false });
await b.close();
