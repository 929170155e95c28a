// Browser test of unit conversion in the page: the evaluation worker carries mathjs's unit
// tables (src/functions/unit-library.ts), so convert works there as on the command line.
import { check } from './harness.mjs';
import { cellText, noteText, openDocument, settled, statusOf } from './page.mjs';

export const convertingTests = [
  {
    name: 'convert in the page: a header unit to kg/ha, exactly, and a plain error for units of different quantities',
    async run({ context, base }) {
      const page = await context.newPage();
      await page.goto(`${base}/?fresh`);
      await settled(page);
      const text = [
        'furrow 1',
        'title: Converted yields',
        '',
        '--- table plots',
        'plot,yield (t/ha)',
        '1,4.35',
        '2,1.005',
        '',
        '--- formula',
        'per_ha = convert(plots["yield (t/ha)"], to: "kg/ha")',
        '',
        '--- formula',
        'wrong = convert(1, "t/ha", "MPa")',
        '',
        '--- formula',
        // the values Node gives (test/functions/units.test.ts runs there): a sealed document verifies in both
        'drift = abs(convert(1, "psi", "Pa") - 6894.757293168362) + abs(convert(1, "lb/acre", "kg/ha") - 1.1208511561944559) + abs(convert(3.7, "psi", "kPa") - 25.51060198472294) + abs(convert(1, "MPa", "psi") - 145.03773773020922) + abs(convert(98.6, "degF", "K") - 310.15)',
        '',
        '--- note',
        'Drift against Node: {drift}.',
        '',
      ].join('\n');
      await openDocument(page, text, 'converted.furrow');
      await page.locator('section[data-name="per_ha"] furrow-value').waitFor();
      await settled(page);
      const shown = (await cellText(page, 'per_ha')) ?? '';
      check(/4350/.test(shown) && /1005/.test(shown), `the converted column: ${shown}`);
      check((await statusOf(page, 'wrong')) === 'error', `the wrong conversion is an error: ${await statusOf(page, 'wrong')}`);
      const wrong = (await cellText(page, 'wrong')) ?? '';
      check(/cannot be converted/.test(wrong) && /different quantities/.test(wrong), `its message: ${wrong}`);
      const drift = (await noteText(page, 'Drift against Node')) ?? '';
      check(/Drift against Node: 0\./.test(drift), `the page converts bit for bit as Node does (sum of differences): ${drift}`);
    },
  },
];
