import { Component, lazy, Suspense, useEffect, useRef, useState, type ReactNode, type RefObject } from 'react';
import type { View } from 'vega';
import type { TopLevelSpec } from 'vega-lite';
import { Button } from '@/components/ui/button';
import { LoadingState } from '@/components/ui/states';

// Vega, Vega-Lite and the interpreter come in their own chunk, fetched the first time a chart is drawn.
const VegaView = lazy(() => import('./vega-view'));

export interface VegaChartProps {
  spec: TopLevelSpec;
  /** Rows of the spec's named datasets, for charts whose data change while their shape stays. */
  datasets?: Record<string, readonly object[]>;
  /** The chart's name, for its accessible name and the download buttons (the spec carries the visible title). */
  title: string;
  /** What the chart shows, in a sentence, for readers who cannot see it. */
  description: string;
  /** Base name of downloaded files, without extension. */
  fileName: string;
  /** Canvas draws thousands of marks faster; SVG is crisper for small charts. Downloads offer both either way. */
  renderer?: 'svg' | 'canvas';
  onDatumClick?: (datum: Record<string, unknown>) => void;
  /** Told each time the chart has been drawn. */
  onDrawn?: () => void;
  /** Name of the User Timing measure recorded per render. */
  timingName?: string;
  /** Reserve this height (Tailwind class) while the chart loads, so the page does not jump. */
  heightClass?: string;
  /** Wide charts scroll sideways instead of shrinking their cells. */
  scrollable?: boolean;
  children?: ReactNode;
}

/** Characters that do not belong in a file name. */
const UNSAFE_FILE_CHARACTERS = /[^\p{L}\p{N}._-]+/gu;

/**
 * A Vega-Lite chart in a card, with PNG and SVG downloads and a text description. The view itself is lazy.
 */
export function VegaChart({ spec, datasets, title, description, fileName, renderer = 'svg', onDatumClick, onDrawn, timingName, heightClass = 'min-h-72', scrollable = false, children }: VegaChartProps) {
  const [view, setView] = useState<View | null>(null);
  const [error, setError] = useState<unknown>(null);
  const [attempt, setAttempt] = useState(0);
  const frame = useRef<HTMLDivElement>(null);
  const visible = useNearViewport(frame);
  const safeName = fileName.replace(UNSAFE_FILE_CHARACTERS, '-');

  const handleDownload = async (type: 'png' | 'svg') => {
    if (!view) return;
    // PNG at twice the screen size, so it stays sharp on a slide.
    const url = await view.toImageURL(type, type === 'png' ? 2 : 1);
    const link = document.createElement('a');
    link.href = url;
    link.download = `${safeName}.${type}`;
    document.body.append(link);
    link.click();
    link.remove();
    if (url.startsWith('blob:')) setTimeout(() => URL.revokeObjectURL(url), 10_000);
  };

  const handleRetry = () => {
    setError(null);
    setAttempt((count) => count + 1);
  };

  return (
    <figure aria-label={title} className="relative min-w-0 rounded-lg border border-paper-200 bg-white p-3 shadow-card">
      {/* Over the chart's top-right corner, beside its title, so the chart keeps the card's full height. */}
      <div className="absolute right-2 top-2 z-10 flex gap-1 rounded-md bg-white/90">
        <Button variant="quiet" className="px-2 py-1 text-xs" disabled={!view} onClick={() => void handleDownload('png')} aria-label={`Download ${title} as PNG`}>
          PNG
        </Button>
        <Button variant="quiet" className="px-2 py-1 text-xs" disabled={!view} onClick={() => void handleDownload('svg')} aria-label={`Download ${title} as SVG`}>
          SVG
        </Button>
      </div>
      <div ref={frame} className={`${heightClass} ${scrollable ? 'overflow-x-auto' : ''}`}>
        {!visible ? null : error ? (
          <ChartProblem error={error} onRetry={handleRetry} />
        ) : (
          <ChartBoundary key={attempt} onError={setError}>
            <Suspense fallback={<LoadingState label="Drawing the chart…" />}>
              <VegaView spec={spec} datasets={datasets} renderer={renderer} onView={setView} onDatumClick={onDatumClick} onDrawn={onDrawn} timingName={timingName} onError={setError} />
            </Suspense>
          </ChartBoundary>
        )}
      </div>
      <figcaption className="sr-only">{description}</figcaption>
      {children}
    </figure>
  );
}

/** How far below the fold a chart starts drawing, px: early enough to be ready when scrolled to. */
const DRAW_AHEAD_PX = 300;

/**
 * True once the element comes near the viewport, and from then on. Charts below the fold wait, so the
 * first chart on a page is not slowed by the ones nobody has scrolled to yet.
 */
function useNearViewport(element: RefObject<HTMLElement | null>): boolean {
  const [near, setNear] = useState(false);
  useEffect(() => {
    const target = element.current;
    if (near || !target) return;
    const observer = new IntersectionObserver((entries) => {
      if (entries.some((entry) => entry.isIntersecting)) setNear(true);
    }, { rootMargin: `${DRAW_AHEAD_PX}px 0px` });
    observer.observe(target);
    return () => observer.disconnect();
  }, [element, near]);
  return near;
}

function ChartProblem({ error, onRetry }: { error: unknown; onRetry: () => void }) {
  const message = error instanceof Error ? error.message : 'The chart could not be drawn.';
  return (
    <div role="alert" className="flex flex-col items-start gap-2 rounded-md border border-signal-danger bg-signal-danger-soft p-4 text-sm">
      <p className="font-semibold text-signal-danger">
        <span aria-hidden>⚠ </span>The chart could not be drawn.
      </p>
      <p className="text-ink-700">{message}</p>
      <Button onClick={onRetry}>Try again</Button>
    </div>
  );
}

/** Catches a failed chunk load or a throw while drawing, so one chart's trouble does not blank the page. */
class ChartBoundary extends Component<{ children: ReactNode; onError: (error: unknown) => void }, { failed: boolean }> {
  state = { failed: false };

  static getDerivedStateFromError() {
    return { failed: true };
  }

  componentDidCatch(error: unknown) {
    this.props.onError(error);
  }

  render() {
    return this.state.failed ? null : this.props.children;
  }
}
