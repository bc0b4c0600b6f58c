import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import Head from 'expo-router/head';
import type { ReactNode } from 'react';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { createQueryClient } from '@/components/api/query-client';
import { sessionKeys } from '@/components/auth/queries';
import type { SessionResponse, SessionUser } from '@/shared/schemas/session';

type Reply = { status: number; body?: unknown };
/** A canned reply, or a function of the request body; `'pending'` never answers (loading states). */
export type Route = Reply | 'pending' | ((body: unknown) => Reply);

/** Demo people and organisation for the tests (invented). */
export const demoUser: SessionUser = {
  id: '0b5a3f0e-8d1c-4c53-9d3e-5b6f2a7c8d90',
  name: 'Ada Okafor',
  email: 'ada@helios.example',
  isOrgAdmin: true,
  organisation: { id: '6f1d2c3b-4a59-4e6f-8a7b-9c0d1e2f3a4b', name: 'Helios Sailworks' },
};

/** A session response for the given user (null: signed out). */
export function demoSession(user: SessionUser | null): SessionResponse {
  return {
    user,
    csrfToken: 'test-csrf-token',
    providers: [
      { id: 'google', label: 'Google', startUrl: '/api/auth/google' },
      { id: 'sso', label: 'Company SSO', startUrl: '/api/auth/sso' },
    ],
    invitationChoice: null,
  };
}

/**
 * Replaces global.fetch with a table of routes keyed "METHOD /path". Unknown routes answer 404 in
 * the API's error shape. Returns the jest mock to inspect the calls.
 */
export function mockFetch(routes: Record<string, Route>) {
  const fetchMock = jest.fn(async (input: string, init?: RequestInit) => {
    const method = init?.method ?? 'GET';
    const route = routes[`${method} ${input}`];
    if (route === 'pending') return new Promise<Response>(() => undefined);
    const body: unknown = typeof init?.body === 'string' ? JSON.parse(init.body) : undefined;
    const reply =
      route === undefined
        ? { status: 404, body: { error: { code: 'not_found', message: `no mock for ${method} ${input}` } } }
        : typeof route === 'function'
          ? route(body)
          : route;
    return {
      ok: reply.status >= 200 && reply.status < 300,
      status: reply.status,
      text: async () => (reply.body === undefined ? '' : JSON.stringify(reply.body)),
    } as Response;
  });
  global.fetch = fetchMock as unknown as typeof fetch;
  return fetchMock;
}

/** A fresh query client (retries off) with the session already known, and a wrapper providing it. */
export function setupQueryClient(user: SessionUser | null = demoUser): {
  queryClient: QueryClient;
  wrapper: (props: { children: ReactNode }) => ReactNode;
} {
  const queryClient = createQueryClient({ retry: false });
  queryClient.setQueryData(sessionKeys.all, demoSession(user));
  const wrapper = ({ children }: { children: ReactNode }) => (
    <Head.Provider>
      <SafeAreaProvider
        initialMetrics={{ frame: { x: 0, y: 0, width: 390, height: 844 }, insets: { top: 0, left: 0, right: 0, bottom: 0 } }}
      >
        <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>
      </SafeAreaProvider>
    </Head.Provider>
  );
  return { queryClient, wrapper };
}
