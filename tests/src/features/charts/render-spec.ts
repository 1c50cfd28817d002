import { parse, View, type Spec } from 'vega';
import { expressionInterpreter } from 'vega-interpreter';
import { compile, type TopLevelSpec } from 'vega-lite';
import { vegaConfig } from '@/features/charts/chart-theme';

/**
 * Compiles a Vega-Lite spec with the charts' config, fills its named datasets, and renders it to SVG the way the browser does it under
 * our Content-Security-Policy: parsed with `ast: true` and evaluated by vega-interpreter, with the
 * Function constructor made to throw, so any code generation would fail the test. Returns the SVG, the
 * compiled Vega spec and the warnings Vega-Lite and Vega logged.
 */
export async function renderSpec(spec: TopLevelSpec, datasets: Record<string, readonly object[]> = {}): Promise<{ svg: string; vega: Spec; warnings: string[] }> {
  const warnings: string[] = [];
  const logger = {
    level: () => logger,
    error: (...args: unknown[]) => {
      throw new Error(args.map(String).join(' '));
    },
    warn: (...args: unknown[]) => {
      warnings.push(args.map(String).join(' '));
      return logger;
    },
    info: () => logger,
    debug: () => logger,
  };
  const vega = compile(spec, { config: vegaConfig, logger: logger as never }).spec;
  const realFunction = globalThis.Function;
  globalThis.Function = new Proxy(realFunction, {
    apply: () => {
      throw new Error('code generation through Function() is not allowed');
    },
    construct: () => {
      throw new Error('code generation through new Function() is not allowed');
    },
  });
  try {
    const view = new View(parse(vega, undefined, { ast: true }), { expr: expressionInterpreter, renderer: 'none', logger: logger as never });
    // Named datasets get their rows as the page gives them to a drawn view.
    for (const [name, rows] of Object.entries(datasets)) view.data(name, [...rows]);
    // Charts that fill their container get a fixed width here.
    view.width(Math.max(view.width(), 600));
    const svg = await view.toSVG();
    view.finalize();
    return { svg, vega, warnings };
  } finally {
    globalThis.Function = realFunction;
  }
}
