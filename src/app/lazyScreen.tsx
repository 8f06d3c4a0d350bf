import { use, type ComponentType, type ReactElement } from 'react';
import { loadOnce, type Settling } from './loadOnce';

type ScreenNeeds = {
  /**
   * Whether the screen reads server data through the query cache. Field screens that work from
   * IndexedDB alone (the pad) say no, so their first load leaves out the query library.
   */
  serverData?: boolean;
};

type ScreenLoader = () => Settling<ComponentType>;

/**
 * A screen in its own chunk, fetched the first time it is shown (or asked for ahead, see
 * firstDrawing in router.tsx). Screens use named exports.
 */
export function screenLoader(
  load: () => Promise<ComponentType>,
  { serverData = true }: ScreenNeeds = {},
): ScreenLoader {
  return loadOnce(async () => {
    if (!serverData) return load();
    const [Loaded, data] = await Promise.all([load(), import('./ServerData')]);
    await data.restored;
    return function WithServerData() {
      return (
        <data.ServerData>
          <Loaded />
        </data.ServerData>
      );
    };
  });
}

/** Draws the loaded screen; until it is in, the nearest Suspense fallback shows. */
function Screen({ loaded }: { loaded: ScreenLoader }) {
  const Loaded = use(loaded());
  // eslint-disable-next-line react-hooks/static-components -- the same component on every drawing (loadOnce)
  return <Loaded />;
}

/** The route element of a screen loaded by `loaded`. */
export const loadedScreen = (loaded: ScreenLoader): ReactElement => <Screen loaded={loaded} />;

/** The route element of a screen in its own chunk. */
export const lazyScreen = (load: () => Promise<ComponentType>, needs?: ScreenNeeds): ReactElement =>
  loadedScreen(screenLoader(load, needs));
