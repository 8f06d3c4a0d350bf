import { lazy, type ComponentType, type ReactElement } from 'react';

type ScreenNeeds = {
  /**
   * Whether the screen reads server data through the query cache. Field screens that work from
   * IndexedDB alone (the pad) say no, so their first load leaves out the query library.
   */
  serverData?: boolean;
};

/**
 * A screen in its own chunk, fetched the first time it is shown. Screens use named exports;
 * React.lazy wants a default one.
 */
export function lazyScreen(
  load: () => Promise<ComponentType>,
  { serverData = true }: ScreenNeeds = {},
): ReactElement {
  const Screen = lazy(async () => {
    if (!serverData) return { default: await load() };
    const [Loaded, data] = await Promise.all([load(), import('./ServerData')]);
    await data.restored;
    const WithServerData = () => (
      <data.ServerData>
        <Loaded />
      </data.ServerData>
    );
    return { default: WithServerData };
  });
  return <Screen />;
}
