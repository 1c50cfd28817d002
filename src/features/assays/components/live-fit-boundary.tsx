import { Component, type ReactNode } from 'react';
import { Notice } from '@/components/ui/notice';

/**
 * Keeps a failure while drawing the live fit from taking the page, and the typed points, with it. It tries
 * again whenever `resetKey` (the points and options) changes.
 */
export class LiveFitBoundary extends Component<{ resetKey: string; children: ReactNode }, { error: Error | null; key: string }> {
  state = { error: null as Error | null, key: this.props.resetKey };

  static getDerivedStateFromError(error: unknown) {
    return { error: error instanceof Error ? error : new Error(String(error)) };
  }

  static getDerivedStateFromProps(props: { resetKey: string }, state: { error: Error | null; key: string }) {
    return props.resetKey === state.key ? null : { error: null, key: props.resetKey };
  }

  render() {
    if (this.state.error) {
      return (
        <Notice tone="danger" title="The live fit could not be shown for these points.">
          {this.state.error.message}. Your points are kept; change them or the model to try again.
        </Notice>
      );
    }
    return this.props.children;
  }
}
