// Browser tests of the designs with more than one error or a covariate, read as a user reads
// them: the split-plot sample shows both strata and the factorial beside it carries the
// warning; the covariate sample heads its means as adjusted; the site series shows the
// treatment tested against the treatment-by-site mean square and each site alone.
import { check } from './harness.mjs';
import { cellText, settled } from './page.mjs';

async function open(context, base, sample) {
  const page = await context.newPage();
  await page.goto(`${base}/?sample=${sample}`);
  await settled(page);
  return page;
}

const oneLine = (t) => (t ?? '').replace(/\s+/g, ' ');

export function strataTests() {
  return [
    {
      name: 'the split-plot sample shows both strata, and the factorial beside it is warned',
      async run({ context, base }) {
        const page = await open(context, base, 'irrigation-split-plot.furrow');
        const fit = oneLine(await cellText(page, 'fit'));
        for (const row of ['block', 'water', 'whole_error', 'variety', 'water:variety', 'error', 'total']) {
          check(fit.includes(` ${row} `), `the split-plot table has the row ${row}: ${fit.slice(0, 600)}`);
        }
        check(fit.includes('Means of water (whole plots)'), `the whole-plot means are headed as such: ${fit.slice(0, 800)}`);
        check(/whole-plot error mean square/.test(fit), 'the record shows mse_whole');
        const naive = oneLine(await cellText(page, 'naive'));
        check(/this looks like a split plot/.test(naive) && /Use split_plot\(y, water, variety, block\)/.test(naive), `the factorial cell carries the warning: ${naive.slice(0, 600)}`);
        const gain = oneLine(await cellText(page, 'l122_water_gain'));
        check(/Satterthwaite/.test(gain), `a comparison across strata names its degrees of freedom: ${gain.slice(0, 400)}`);
        await page.close();
      },
    },
    {
      name: 'the covariate sample heads its means as adjusted and shows the slope',
      async run({ context, base }) {
        const page = await open(context, base, 'lamb-rations-covariate.furrow');
        const fit = oneLine(await cellText(page, 'fit'));
        check(fit.includes("Adjusted means of ration (at the covariate's mean)"), `adjusted means heading: ${fit.slice(0, 800)}`);
        check(/ start_kg 1 /.test(fit), `the table has the covariate's row: ${fit.slice(0, 600)}`);
        check(/slope on the covariate/.test(fit), 'the slope is shown');
        const plain = oneLine(await cellText(page, 'plain'));
        check(plain.includes('Means of ration') && !plain.includes('Adjusted'), 'the fit without the covariate keeps plain means');
        await page.close();
      },
    },
    {
      name: 'the site series shows the treatment against the treatment-by-site mean square and each site alone',
      async run({ context, base }) {
        const page = await open(context, base, 'variety-series-sites.furrow');
        const fit = oneLine(await cellText(page, 'fit'));
        for (const row of ['farm', 'block within farm', 'variety', 'variety:farm', 'error', 'total']) {
          check(fit.includes(` ${row} `), `the series table has the row ${row}: ${fit.slice(0, 600)}`);
        }
        check(/Bartlett's test of equal error variances across sites before pooling/.test(fit), 'Bartlett is stated in the notes');
        check(/ Upland 3 /.test(fit) && / Stony 3 /.test(fit), `each farm's own analysis is shown: ${fit.slice(0, 1500)}`);
        await page.close();
      },
    },
  ];
}
