import { act } from 'react';

/** A stand-in for the browser's EventSource: the test opens it, sends events and drops it. */
export class FakeEventSource {
  static last: FakeEventSource | undefined;
  onopen: (() => void) | null = null;
  onerror: (() => void) | null = null;
  onmessage: ((event: MessageEvent) => void) | null = null;
  closed = false;
  private readonly listeners = new Map<string, ((event: MessageEvent) => void)[]>();

  constructor(readonly url: string) {
    FakeEventSource.last = this;
  }

  addEventListener(type: string, listener: (event: MessageEvent) => void) {
    this.listeners.set(type, [...(this.listeners.get(type) ?? []), listener]);
  }

  close() {
    this.closed = true;
  }

  open() {
    act(() => this.onopen?.());
  }

  drop() {
    act(() => this.onerror?.());
  }

  send(type: string, data: unknown) {
    const event = { data: JSON.stringify(data) } as MessageEvent;
    act(() => {
      for (const listener of this.listeners.get(type) ?? []) listener(event);
    });
  }
}
