import { Component, type ReactNode } from 'react';

/**
 * Keeps a failure in one panel from blanking the page: the panel shows what went wrong and can be
 * redrawn, everything else (and the saved workspace) stays.
 */
export class PanelBoundary extends Component<{ name: string; children: ReactNode }, { error: Error | null }> {
  override state: { error: Error | null } = { error: null };

  static getDerivedStateFromError(error: Error) {
    return { error };
  }

  override render() {
    if (!this.state.error) return this.props.children;
    return (
      <div className="panel-failed" role="alert">
        <strong>{this.props.name} could not be drawn:</strong> {this.state.error.message}{' '}
        <button type="button" onClick={() => this.setState({ error: null })}>
          Try again
        </button>
      </div>
    );
  }
}
