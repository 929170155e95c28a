import { existsSync } from 'node:fs';
import * as vega from 'vega';
import { expressionInterpreter } from 'vega-interpreter';
import { compile } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import { cleanSpec, collectingLogger, LoadRefused, lockedLoader, MAX_MESSAGES, safeEmbedOptions } from '../../../src/views/values/chart-safety.ts';

const points = { values: [{ x: 1, y: 2 }, { x: 2, y: 3 }] };

describe('cleanSpec', () => {
  it('drops usermeta and $schema, at the top and in nested views', () => {
    const spec = {
      $schema: 'https://example.invalid/schema.json',
      usermeta: { embedOptions: { actions: true, config: 'https://example.invalid/config.json' } },
      layer: [{ usermeta: { embedOptions: { actions: true } }, mark: 'point', data: points }],
      hconcat: [{ spec: { usermeta: {}, mark: 'bar' } }],
    };
    const out = cleanSpec(spec)!;
    expect('usermeta' in out).toBe(false);
    expect('$schema' in out).toBe(false);
    const layer = (out.layer as Record<string, unknown>[])[0]!;
    expect('usermeta' in layer).toBe(false);
    expect(layer.mark).toBe('point');
    const inner = ((out.hconcat as Record<string, unknown>[])[0]!.spec as Record<string, unknown>);
    expect('usermeta' in inner).toBe(false);
    // the original is left as it was
    expect('usermeta' in spec).toBe(true);
    expect(spec.layer[0]!.usermeta).toBeDefined();
  });

  it('keeps data values even when a field happens to be named usermeta', () => {
    const out = cleanSpec({ mark: 'point', data: { values: [{ usermeta: 1, $schema: 2 }] } })!;
    expect((out.data as { values: unknown[] }).values[0]).toEqual({ usermeta: 1, $schema: 2 });
  });

  it('returns a plain JSON copy, without functions', () => {
    const out = cleanSpec({ mark: 'point', f: () => 1, data: points })!;
    expect('f' in out).toBe(false);
    expect(out.data).toEqual(points);
    expect(out.data).not.toBe(points);
  });

  it('refuses what is not a JSON object', () => {
    const cyclic: Record<string, unknown> = { mark: 'point' };
    cyclic.self = cyclic;
    expect(cleanSpec(cyclic)).toBeNull();
    expect(cleanSpec([1, 2])).toBeNull();
    expect(cleanSpec('{"mark":"point"}')).toBeNull();
    expect(cleanSpec(undefined)).toBeNull();
    expect(cleanSpec(null)).toBeNull();
  });
});

describe('lockedLoader', () => {
  const loader = lockedLoader(vega.loader());

  it('refuses every way of reaching outside: load, sanitize, http, file', async () => {
    for (const uri of ['/etc/passwd', 'file:///etc/passwd', 'https://example.invalid/data.csv', 'data:text/csv,a%0A1', 'javascript:alert(1)', 'plots.csv']) {
      await expect(loader.load(uri)).rejects.toBeInstanceOf(LoadRefused);
      await expect(loader.sanitize(uri, { context: 'href' })).rejects.toBeInstanceOf(LoadRefused);
    }
    await expect(loader.http('https://example.invalid/', {})).rejects.toBeInstanceOf(LoadRefused);
    await expect(loader.file('/etc/passwd')).rejects.toBeInstanceOf(LoadRefused);
  });

  it('cannot be changed afterwards', () => {
    expect(Object.isFrozen(loader)).toBe(true);
  });
});

describe('a chart that asks for a file, drawn headless with the locked loader', () => {
  const spec = {
    data: { url: '/etc/passwd', format: { type: 'dsv', delimiter: ':' } },
    mark: 'point',
    encoding: { x: { field: 'a', type: 'nominal' } },
  } as const;

  async function rowsLoaded(loader: vega.Loader, logger = collectingLogger()) {
    const vg = compile(spec as never).spec;
    const view = new vega.View(vega.parse(vg, undefined, { ast: true }), {
      renderer: 'none',
      loader,
      logger: logger as never,
      expr: expressionInterpreter,
    });
    await view.runAsync();
    const names = (vg.data ?? []).map((d) => d.name);
    let rows = 0;
    for (const name of names) rows += (view.data(name) as unknown[]).length;
    view.finalize();
    return { rows, messages: logger.messages };
  }

  it.runIf(existsSync('/etc/passwd'))('reads nothing and says so', async () => {
    const { rows, messages } = await rowsLoaded(lockedLoader(vega.loader()));
    expect(rows).toBe(0);
    expect(messages.some((m) => /refused/.test(m))).toBe(true);
  });

  // The check above means something only if the same spec does read the file when the
  // loader is left open (docs/libraries.md section 3: vega's default loader reads local files in Node).
  it.runIf(existsSync('/etc/passwd'))('would have read the file with vega\'s default loader', async () => {
    const { rows } = await rowsLoaded(vega.loader({ mode: 'file' }));
    expect(rows).toBeGreaterThan(0);
  });
});

describe('collectingLogger', () => {
  it('keeps warnings and errors once each, drops info and debug, and caps the list', () => {
    let calls = 0;
    const log = collectingLogger(() => calls++);
    log.warn('Loading failed', new Error('no'));
    log.warn('Loading failed', new Error('no'));
    log.error('bad');
    log.info('chatter');
    log.debug('more');
    expect(log.messages).toEqual(['Loading failed no', 'bad']);
    expect(calls).toBe(2);
    for (let i = 0; i < 50; i++) log.warn(`w${i}`);
    expect(log.messages.length).toBe(MAX_MESSAGES);
  });

  it('follows vega\'s level calls', () => {
    const log = collectingLogger();
    expect(log.level()).toBe(2);
    expect(log.level(0)).toBe(log);
    log.warn('quiet now');
    expect(log.messages).toEqual([]);
  });
});

describe('safeEmbedOptions', () => {
  it('locks everything a spec or a default could open', () => {
    const loader = lockedLoader(vega.loader());
    const logger = collectingLogger();
    const o = safeEmbedOptions(loader, logger, expressionInterpreter);
    expect(o).toMatchObject({ mode: 'vega-lite', renderer: 'svg', actions: false, ast: true, tooltip: true });
    expect(o.loader).toBe(loader);
    expect(o.logger).toBe(logger);
    expect(o.expr).toBe(expressionInterpreter);
    // nothing that vega-embed would fetch by URL
    expect(o.config).toBeUndefined();
    expect(o.patch).toBeUndefined();
    expect(o.editorUrl).toBeUndefined();
  });
});
