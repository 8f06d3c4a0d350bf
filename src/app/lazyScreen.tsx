import { lazy, type ComponentType, type ReactElement } from 'react';

/**
 * A screen in its own chunk, fetched the first time it is shown. Screens use named exports;
 * React.lazy wants a default one.
 */
export function lazyScreen(load: () => Promise<ComponentType>): ReactElement {
  const Screen = lazy(async () => ({ default: await load() }));
  return <Screen />;
}
