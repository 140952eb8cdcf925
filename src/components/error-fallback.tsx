import { Component, type ErrorInfo, type ReactNode } from 'react';
import { BrandMark } from './brand-mark';
import { buttonClasses } from './button';

/** The calm "something broke" panel. `homeHref` is a plain link so it works even if the router failed. */
export function ErrorFallback({
  title = 'This page ran into a problem',
  message,
  homeHref = '/',
  children,
}: {
  title?: string;
  message?: ReactNode;
  homeHref?: string;
  children?: ReactNode;
}) {
  return (
    <div role="alert" className="mx-auto max-w-lg px-4 py-12 text-center">
      <BrandMark size={40} className="mx-auto text-ink-700" />
      <h1 className="mt-4 text-2xl font-bold text-ink-900">{title}</h1>
      <p className="mt-2 text-ink-700">{message ?? 'Nothing you entered has been lost on the server. Reload the page, or go back to your home page.'}</p>
      <div className="mt-6 flex flex-wrap justify-center gap-2">
        {children ?? (
          <>
            <a href={homeHref} className={buttonClasses('primary')}>
              Go to my home page
            </a>
            <button type="button" className={buttonClasses('secondary')} onClick={() => window.location.reload()}>
              Reload
            </button>
          </>
        )}
      </div>
    </div>
  );
}

/** Last line of defence above the router; route errors are caught by the route's errorElement first. */
export class ErrorBoundary extends Component<{ children: ReactNode }, { error: unknown }> {
  state: { error: unknown } = { error: null };

  static getDerivedStateFromError(error: unknown) {
    return { error };
  }

  componentDidCatch(error: unknown, info: ErrorInfo) {
    console.error('Nestkeeper crashed', error, info.componentStack);
  }

  render() {
    if (this.state.error) return <ErrorFallback />;
    return this.props.children;
  }
}
