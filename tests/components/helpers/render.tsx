import { configure } from '@testing-library/dom';
import { act, type ComponentType, type ReactNode } from 'react';
import { createRoot, type Root } from 'react-dom/client';
import { ExpoRoot } from 'expo-router';
import { getMockContext } from 'expo-router/build/testing-library/mock-config';

// react-native-web renders DOM elements, so these tests render with react-dom into jsdom and query the DOM
// with @testing-library/dom; the react-native testing library only recognises native host components.
// Events run inside act(); while a query waits, act is off so that React Query's async updates render
// as in a browser (the same arrangement @testing-library/react makes).
const actGlobal = globalThis as { IS_REACT_ACT_ENVIRONMENT?: boolean };
actGlobal.IS_REACT_ACT_ENVIRONMENT = true;
configure({
  eventWrapper: (dispatch) => {
    let result: unknown;
    act(() => {
      result = dispatch();
    });
    return result;
  },
  asyncWrapper: async (wait) => {
    actGlobal.IS_REACT_ACT_ENVIRONMENT = false;
    try {
      return await wait();
    } finally {
      actGlobal.IS_REACT_ACT_ENVIRONMENT = true;
    }
  },
});

// jsdom has no ResizeObserver; the stack navigator's web frame listener needs one (it never fires here).
globalThis.ResizeObserver ??= class {
  observe() {}
  unobserve() {}
  disconnect() {}
};

let mounted: { root: Root; container: HTMLElement }[] = [];

afterEach(() => {
  for (const { root, container } of mounted) {
    act(() => root.unmount());
    container.remove();
  }
  mounted = [];
});

/** Renders a React tree into the document (unmounted after each test). */
export function renderDom(ui: ReactNode): HTMLElement {
  const container = document.createElement('div');
  document.body.appendChild(container);
  const root = createRoot(container);
  act(() => root.render(ui));
  mounted.push({ root, container });
  return container;
}

/**
 * Renders an in-memory expo-router app (route name → component, as files under app/ would be) at a URL,
 * inside the given providers.
 */
export function renderRoutes(
  routes: Record<string, ComponentType>,
  initialUrl: string,
  Wrapper: ComponentType<{ children: ReactNode }>,
): HTMLElement {
  process.env.EXPO_ROUTER_IMPORT_MODE = 'sync';
  const context = getMockContext(Object.fromEntries(Object.entries(routes).map(([name, component]) => [name, { default: component }])));
  return renderDom(
    <Wrapper>
      <ExpoRoot context={context} location={initialUrl} />
    </Wrapper>,
  );
}
