import { Component, type ReactNode } from 'react';
import { useLocation } from 'react-router-dom';
import { RouteError } from './RouteError';

type CatcherProps = { children: ReactNode; pathname: string };
type CatcherState = { failure: { error: unknown } | null; pathname: string };

class ErrorCatcher extends Component<CatcherProps, CatcherState> {
  override state: CatcherState = { failure: null, pathname: this.props.pathname };

  static getDerivedStateFromError(error: unknown): Partial<CatcherState> {
    return { failure: { error } };
  }

  // Going to another address tries again, so "Go to start" leaves a failed screen.
  static getDerivedStateFromProps(props: CatcherProps, state: CatcherState): Partial<CatcherState> | null {
    return props.pathname === state.pathname ? null : { failure: null, pathname: props.pathname };
  }

  override render() {
    return this.state.failure ? <RouteError error={this.state.failure.error} /> : this.props.children;
  }
}

/** Shows RouteError instead of a blank page when a screen fails to load or throws. */
export function RouteBoundary({ children }: { children: ReactNode }) {
  const { pathname } = useLocation();
  return <ErrorCatcher pathname={pathname}>{children}</ErrorCatcher>;
}
