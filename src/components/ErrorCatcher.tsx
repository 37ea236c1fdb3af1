import { Component, type ReactNode } from 'react';
import { RouteError } from './RouteError';

interface Props {
  children: ReactNode;
  /** Changing this (say, the pathname) clears a caught error, so moving elsewhere recovers. */
  resetKey: string;
  onHome?: () => void;
}

/**
 * Catches a crash inside the shell's content area so the navigation stays
 * usable; the root layout's ErrorBoundary only catches what this misses.
 */
export class ErrorCatcher extends Component<Props, { error: Error | null; key: string }> {
  state = { error: null as Error | null, key: this.props.resetKey };

  static getDerivedStateFromError(error: Error) {
    return { error };
  }

  static getDerivedStateFromProps(props: Props, state: { error: Error | null; key: string }) {
    return props.resetKey !== state.key ? { error: null, key: props.resetKey } : null;
  }

  render() {
    if (this.state.error) {
      return <RouteError error={this.state.error} retry={() => this.setState({ error: null })} onHome={this.props.onHome} />;
    }
    return this.props.children;
  }
}
