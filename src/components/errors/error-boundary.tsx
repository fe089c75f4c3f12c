import { Component, type ErrorInfo, type ReactNode } from 'react';

interface ErrorBoundaryProps {
  /** What to show instead of the broken part; `reset` tries to render it again. */
  fallback: (props: { error: unknown; reset: () => void }) => ReactNode;
  onReset?: () => void;
  children: ReactNode;
}

interface ErrorBoundaryState {
  error: unknown;
  hasError: boolean;
}

/** Keeps a failure inside one part of a page so the rest stays usable. */
export class ErrorBoundary extends Component<ErrorBoundaryProps, ErrorBoundaryState> {
  override state: ErrorBoundaryState = { error: null, hasError: false };

  static getDerivedStateFromError(error: unknown): ErrorBoundaryState {
    return { error, hasError: true };
  }

  override componentDidCatch(error: unknown, info: ErrorInfo): void {
    console.error('A part of the page failed to render', error, info.componentStack);
  }

  private reset = () => {
    this.props.onReset?.();
    this.setState({ error: null, hasError: false });
  };

  override render(): ReactNode {
    if (this.state.hasError) return this.props.fallback({ error: this.state.error, reset: this.reset });
    return this.props.children;
  }
}
