import { useEffect, useLayoutEffect, useMemo, useRef, useState } from 'react';
import { VegaEmbed } from 'react-vega';
import type { View } from 'vega';
import type { EmbedOptions, Result } from 'vega-embed';
import { expressionInterpreter } from 'vega-interpreter';
import type { TopLevelSpec } from 'vega-lite';
import { vegaConfig } from '../chart-theme';

export interface VegaViewProps {
  spec: TopLevelSpec;
  /** Rows of the spec's named datasets; a change reaches the drawn view without compiling it again. */
  datasets?: Record<string, readonly object[]>;
  renderer: 'svg' | 'canvas';
  /** The view once it is drawn (for downloads), null while it is being replaced. */
  onView: (view: View | null) => void;
  /** Called with the data row under the pointer when a mark is clicked. */
  onDatumClick?: (datum: Record<string, unknown>) => void;
  onDrawn?: () => void;
  /** Name of the performance measure recorded for each render (User Timing API). */
  timingName?: string;
  onError: (error: unknown) => void;
}

/**
 * The part of a chart that needs Vega, loaded as its own chunk. Expressions run through vega-interpreter
 * (`ast: true`), so the Content-Security-Policy needs no 'unsafe-eval'.
 */
export default function VegaView({ spec, datasets, renderer, onView, onDatumClick, onDrawn, timingName, onError }: VegaViewProps) {
  // The spec as last embedded: a rebuilt but equal spec keeps the drawn view (only its data change).
  const specText = JSON.stringify(spec);
  const [embedded, setEmbedded] = useState({ text: specText, spec });
  if (embedded.text !== specText) setEmbedded({ text: specText, spec });

  const latestData = useRef(datasets);
  const shownData = useRef<VegaViewProps['datasets']>(undefined);
  // The drawn view with the spec it was drawn from: data go only to a view of the current spec.
  const [drawn, setDrawn] = useState<{ view: View; spec: unknown } | null>(null);
  const handlers = useRef({ onDatumClick, onView, onError, onDrawn });
  useLayoutEffect(() => {
    handlers.current = { onDatumClick, onView, onError, onDrawn };
    latestData.current = datasets;
  });

  const options = useMemo<EmbedOptions>(
    () => ({
      mode: 'vega-lite',
      ast: true,
      expr: expressionInterpreter,
      // Our own download buttons replace the embed menu, which is not keyboard friendly.
      actions: false,
      renderer,
      config: vegaConfig,
      // The first drawing already holds the data, read from a ref so the options never change with it.
      patch: (compiled) => {
        shownData.current = latestData.current;
        const rows = latestData.current;
        return { ...compiled, data: compiled.data?.map((entry) => (rows?.[entry.name] ? { ...entry, values: [...rows[entry.name]] } : entry)) };
      },
    }),
    [renderer],
  );

  const startedAt = useRef(0);
  // A layout effect runs before the embed's passive effect, so the measure covers compile, parse and draw;
  // the old view is finalized by the embed, so downloads wait for the new one.
  useLayoutEffect(() => {
    startedAt.current = performance.now();
    handlers.current.onView(null);
  }, [embedded.spec]);

  useEffect(() => {
    if (!drawn || drawn.spec !== embedded.spec || !datasets || shownData.current === datasets) return;
    shownData.current = datasets;
    for (const [name, rows] of Object.entries(datasets)) drawn.view.data(name, [...rows]);
    drawn.view.runAsync().catch((error: unknown) => handlers.current.onError(error));
  }, [drawn, embedded.spec, datasets]);

  const handleEmbed = (result: Result) => {
    if (timingName) performance.measure(timingName, { start: startedAt.current, end: performance.now() });
    result.view.addEventListener('click', (_event, item) => {
      const datum = (item as { datum?: unknown } | null | undefined)?.datum;
      if (datum && typeof datum === 'object') handlers.current.onDatumClick?.(datum as Record<string, unknown>);
    });
    setDrawn({ view: result.view, spec: result.spec });
    handlers.current.onView(result.view);
    handlers.current.onDrawn?.();
  };

  return <VegaEmbed spec={embedded.spec} options={options} onEmbed={handleEmbed} onError={onError} className="w-full" />;
}
