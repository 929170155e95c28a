/**
 * convert through the built command line: the unit tables load from their own file beside
 * the chunk that needs them (build/cli/chunks/unit-library.cjs) at the first conversion.
 */
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { builtLoads, scratch } from './support.ts';

describe('furrow run with a conversion', () => {
  it('converts a column whose header carries its unit, exactly on its digits', () => {
    const dir = scratch({
      'c.furrow': 'furrow 1\ntitle: c\n\n--- table p\nyield (t/ha)\n4.35\n1.005\n\n--- formula\nkg = convert(p["yield (t/ha)"], to: "kg/ha")\n\n--- formula\nbad = convert(1, "t/ha", "MPa")\n',
    });
    const r = spawnSync(process.execPath, ['bin/furrow.js', 'run', join(dir, 'c.furrow'), '--json'], { encoding: 'utf8' });
    // the tests' global setup builds the command line, so this runs the bundle, not the sources
    expect(r.stderr).toBe('');
    expect(r.status).toBe(1);
    const cells = JSON.parse(r.stdout).cells;
    expect(cells[1].value).toEqual([4350, 1005]);
    expect(cells[2].error.message).toBe('convert: "t/ha" cannot be converted to "MPa": they measure different quantities. Check both units (for example a mass per area, "t/ha", converts to "kg/ha" or "g/m^2", not to "kg").');
  });

  it('loads the unit tables of the build, not the whole mathjs package, and only to convert', () => {
    const dir = scratch({
      'c.furrow': 'furrow 1\n--- formula\nk = convert(212, "degF", "K")\n',
      'n.furrow': 'furrow 1\n--- formula\nk = sqrt(212)\n',
    });
    const r = builtLoads('run', join(dir, 'c.furrow'), '--json');
    expect(r.status).toBe(0);
    expect(JSON.parse(r.out).cells[0].value).toBe(373.15);
    expect(r.required).toContain('./unit-library.cjs');
    expect(r.required).not.toContain('mathjs');
    expect(builtLoads('run', join(dir, 'n.furrow')).required).not.toContain('./unit-library.cjs');
  });
});
