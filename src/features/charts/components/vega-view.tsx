import { useLayoutEffect, useMemo, useRef } from 'react';
import { VegaEmbed } from 'react-vega';
import type { View } from 'vega';
import type { EmbedOptions, Result } from 'vega-embed';
import { expressionInterpreter } from 'vega-interpreter';
import type { TopLevelSpec } from 'vega-lite';
import { vegaConfig } from '../chart-theme';

export interface VegaViewProps {
  spec: TopLevelSpec;
  renderer: 'svg' | 'canvas';
  /** The view once it is drawn (for downloads), null when it is replaced. */
  onView: (view: View | null) => void;
  /** Called with the data row under the pointer when a mark is clicked. */
  onDatumClick?: (datum: Record<string, unknown>) => void;
  /** Name of the performance measure recorded for each render (User Timing API). */
  timingName?: string;
  onError: (error: unknown) => void;
}

/**
 * The part of a chart that needs Vega, loaded as its own chunk. Expressions run through vega-interpreter
 * (`ast: true`), so the Content-Security-Policy needs no 'unsafe-eval'.
 */
export default function VegaView({ spec, renderer, onView, onDatumClick, timingName, onError }: VegaViewProps) {
  const options = useMemo<EmbedOptions>(
    () => ({
      mode: 'vega-lite',
      ast: true,
      expr: expressionInterpreter,
      // Our own download buttons replace the embed menu, which is not keyboard friendly.
      actions: false,
      renderer,
      config: vegaConfig,
    }),
    [renderer],
  );
  const startedAt = useRef(0);
  const handlers = useRef({ onDatumClick, onView });
  useLayoutEffect(() => {
    handlers.current = { onDatumClick, onView };
  });
  // A layout effect runs before the embed's passive effect, so the measure covers compile, parse and draw;
  // the old view is finalized by the embed, so downloads wait for the new one.
  useLayoutEffect(() => {
    startedAt.current = performance.now();
    handlers.current.onView(null);
  }, [spec]);

  const handleEmbed = (result: Result) => {
    if (timingName) performance.measure(timingName, { start: startedAt.current, end: performance.now() });
    result.view.addEventListener('click', (_event, item) => {
      const datum = (item as { datum?: unknown } | null | undefined)?.datum;
      if (datum && typeof datum === 'object') handlers.current.onDatumClick?.(datum as Record<string, unknown>);
    });
    handlers.current.onView(result.view);
  };

  return <VegaEmbed spec={spec} options={options} onEmbed={handleEmbed} onError={onError} className="w-full" />;
}
