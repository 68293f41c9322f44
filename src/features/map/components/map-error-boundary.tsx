import { Component, type ErrorInfo, type ReactNode } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';

/** Around the map only: if drawing fails, the filters, legend and lists stay usable. */
export class MapErrorBoundary extends Component<{ children: ReactNode }, { error: Error | null }> {
  state: { error: Error | null } = { error: null };

  static getDerivedStateFromError(error: Error) {
    return { error };
  }

  componentDidCatch(error: Error, info: ErrorInfo) {
    console.error('[heelwood] the map failed to draw', error, info.componentStack);
  }

  render() {
    if (!this.state.error) return this.props.children;
    return (
      <div className="flex min-h-[22rem] flex-col items-start justify-center gap-4 rounded-card border border-paper-edge bg-paper-deep p-6">
        <Alert tone="danger" title="The map could not be drawn">
          Something went wrong while drawing the map ({this.state.error.message}). The plant list still works; try drawing the map again.
        </Alert>
        <Button onClick={() => this.setState({ error: null })}>Draw the map again</Button>
      </div>
    );
  }
}
