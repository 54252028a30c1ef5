// Drives VS Code (a code-server build) in headless Chromium with the kiln
// extension installed: diagnostics, hover, inlay hints and the NASA-7 quick
// fix on fixture.kiln, and the equilibrium code lens, against the real
// server. Run by run.sh.
// Environment: PORT (code-server), WS (workspace folder), CHROMIUM, SHOTS
// (directory for screenshots).
import { chromium } from 'playwright-core';

const port = process.env.PORT;
const ws = process.env.WS;
const shots = process.env.SHOTS || '.';
let passed = 0;
let failed = 0;
const log = (...a) => console.log(...a);

const browser = await chromium.launch({
  executablePath: process.env.CHROMIUM || '/usr/bin/chromium',
  args: ['--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage'],
});
const page = await browser.newPage({ viewport: { width: 1400, height: 900 } });

async function check(name, fn) {
  try {
    await fn();
    passed++;
    log(`ok   ${name}`);
  } catch (e) {
    failed++;
    log(`FAIL ${name}: ${e && e.message ? e.message.split('\n')[0] : e}`);
    await page.screenshot({ path: `${shots}/fail-${passed + failed}.png` }).catch(() => {});
  }
}

const line = (n) => page.locator('.monaco-editor .view-lines .view-line').nth(n - 1);
// Lines are rendered in DOM order of creation, not by line number: find by text.
const lineWith = (text) => page.locator('.monaco-editor .view-lines .view-line', { hasText: text }).first();

await check('workbench loads and opens fixture.kiln', async () => {
  await page.goto(`http://127.0.0.1:${port}/?folder=${ws}`);
  await page.waitForSelector('.monaco-workbench', { timeout: 90000 });
  await page.click('.explorer-folders-view .monaco-list-row[aria-label*="fixture.kiln"]', { timeout: 60000 });
  await page.waitForSelector('.monaco-editor .view-lines .view-line', { timeout: 30000 });
  await lineWith('species ethanol').waitFor({ timeout: 30000 });
});

await check('diagnostics: undeclared HO2 is underlined as an error', async () => {
  const sq = await page.waitForSelector('.monaco-editor .squiggly-error', { timeout: 90000 });
  const box = await sq.boundingBox();
  const r = await lineWith('reaction ethanol').boundingBox();
  if (!box || !r || Math.abs(box.y - r.y) > r.height) {
    throw new Error('error squiggle is not on the reaction line');
  }
  await page.screenshot({ path: `${shots}/diagnostics.png` });
});

await check('inlay hints: estimated ΔHf at the end of the ethane line', async () => {
  await page.waitForFunction(
    () => [...document.querySelectorAll('.monaco-editor .view-lines .view-line')]
      .map((l) => l.textContent.replace(/\u00a0/g, ' '))
      .some((t) => t.startsWith('species ethane ') && t.includes('ΔHf')),
    null,
    { timeout: 60000 },
  );
});

await check('hover on a species name shows thermochemistry', async () => {
  // The code lens above the first species line and the inlay hints can
  // arrive after the word's box is measured and move the line; each try
  // measures it afresh (a layout shift, not a missing hover, is retried).
  let lastErr;
  for (let attempt = 0; attempt < 4; attempt++) {
    const word = lineWith('species ethanol').locator('span', { hasText: 'ethanol' }).last();
    const bb = await word.boundingBox();
    await page.mouse.move(5, 5);
    await page.mouse.move(bb.x + bb.width / 2 + 30, bb.y + bb.height / 2);
    await page.mouse.move(bb.x + bb.width / 2, bb.y + bb.height / 2);
    try {
      await page.waitForFunction(
        () => [...document.querySelectorAll('.monaco-hover:not(.hidden)')].some((h) => h.textContent.includes('ΔHf°298')
          && h.textContent.includes('46.069 g/mol')),
        null,
        { timeout: 15000 },
      );
      lastErr = undefined;
      break;
    } catch (err) {
      lastErr = err;
    }
  }
  if (lastErr) {
    throw lastErr;
  }
  await page.screenshot({ path: `${shots}/hover.png` });
  await page.mouse.move(5, 5);
  await page.keyboard.press('Escape');
});

await check('quick fix inserts a NASA-7 block under ethanol', async () => {
  const word = lineWith('species ethanol').locator('span', { hasText: 'ethanol' }).last();
  await word.click();
  await page.keyboard.press('Control+.');
  await page.waitForFunction(
    () => [...document.querySelectorAll('.action-widget')].some((w) => w.textContent.includes('Insert estimated NASA-7')),
    null,
    { timeout: 30000 },
  );
  await page.screenshot({ path: `${shots}/quickfix.png` });
  // The first (focused) entry is the NASA-7 fix.
  await page.keyboard.press('Enter');
  await page.waitForFunction(
    () => [...document.querySelectorAll('.monaco-editor .view-lines .view-line')]
      .some((l) => /^\s+nasa7\s/.test(l.textContent)),
    null,
    { timeout: 30000 },
  );
  await page.screenshot({ path: `${shots}/after-fix.png` });
});

await check('code lens: Equilibrium / flame temperature… asks for the mixture and shows the result', async () => {
  const lens = page.locator('.monaco-editor .codelens-decoration a', { hasText: 'Equilibrium / flame temperature' }).first();
  await lens.waitFor({ timeout: 60000 });
  await page.screenshot({ path: `${shots}/codelens.png` });
  await lens.click();
  // The input box has the focus.
  await page.locator('.quick-input-widget', { hasText: 'Mixture as NAME:AMOUNT' }).waitFor({ state: 'visible', timeout: 30000 });
  await page.keyboard.type('ethanol:1, ethane:1');
  await page.keyboard.press('Enter');
  // The "kiln equilibrium" output channel shows what `kiln equilibrium` prints.
  await page.waitForFunction(
    () => [...document.querySelectorAll('.part.panel .view-lines')]
      .map((v) => v.textContent.replace(/\u00a0/g, ' '))
      .some((t) => t.includes('mix: ethanol:1, ethane:1')
        && t.includes('Equilibrium of fixture.kiln, adiabatic at constant pressure')
        && /final\s+T = \d+\.\d\d K/.test(t)),
    null,
    { timeout: 60000 },
  );
  await page.screenshot({ path: `${shots}/equilibrium.png` });
});

await browser.close();
log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 ? 1 : 0);
