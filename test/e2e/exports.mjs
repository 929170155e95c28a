// Browser tests of saving from the page: every table (data, analysis tables, means, pairs,
// a summary table) as CSV, every chart as SVG and PNG. Files are caught as downloads and read.
import { readFileSync } from 'node:fs';
import { check } from './harness.mjs';
import { settled } from './page.mjs';

/** Clicks a button in a cell and returns the file it saves: its name and bytes. */
async function saved(page, cell, button) {
  const section = page.locator(`section[data-name="${cell}"]`);
  await section.scrollIntoViewIfNeeded();
  const target = section.locator('button', { hasText: button }).first();
  await target.waitFor({ timeout: 20_000 });
  const [download] = await Promise.all([page.waitForEvent('download'), target.click()]);
  const path = await download.path();
  return { name: download.suggestedFilename(), bytes: readFileSync(path) };
}

export const exportTests = [
  {
    name: 'tables save as CSV and charts as SVG and PNG from the page',
    async run({ context, base }) {
      const page = await context.newPage();
      await page.goto(`${base}/?fresh`);
      await settled(page);
      const data = await saved(page, 'coupons', 'Save CSV');
      check(data.name === 'coupons.csv', `data file name: ${data.name}`);
      check(data.bytes.toString('utf8').startsWith('batch,position,cure,shear_mpa\n1,1,60C,23.4\n'), `data: ${data.bytes.toString('utf8').slice(0, 80)}`);
      const anova = await saved(page, 'fit', 'Save the analysis table (CSV)');
      check(anova.bytes.toString('utf8').startsWith('source,df,ss,ms,f,p\ncure,3,'), `analysis table: ${anova.bytes.toString('utf8').slice(0, 80)}`);
      const means = await saved(page, 'fit', 'Save the means (CSV)');
      check(means.name === 'fit-means.csv' && means.bytes.toString('utf8').startsWith('level,n,mean,se,low,high\n60C,6,'), `means: ${means.name} ${means.bytes.toString('utf8').slice(0, 80)}`);
      const pairs = await saved(page, 'pairs', 'Save the pairs (CSV)');
      check(/^a,b,estimate,se,low,high,p/.test(pairs.bytes.toString('utf8')), `pairs: ${pairs.bytes.toString('utf8').slice(0, 80)}`);
      const summary = await saved(page, 'by_batch', 'Save CSV');
      check(summary.bytes.toString('utf8').startsWith('level,n,mean,sd,se\n1,4,'), `summary table: ${summary.bytes.toString('utf8').slice(0, 80)}`);
      const svg = await saved(page, 'means_plot', 'Save SVG');
      check(svg.name === 'means_plot.svg' && svg.bytes.toString('utf8').startsWith('<svg'), `svg: ${svg.name} ${svg.bytes.toString('utf8').slice(0, 40)}`);
      const png = await saved(page, 'means_plot', 'Save PNG');
      check(png.name === 'means_plot.png' && png.bytes.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])), `png: ${png.name}, ${png.bytes.length} bytes`);
    },
  },
];
