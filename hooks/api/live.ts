/**
 * The live board: GET /api/live/board for the first picture, then GET /api/live/stream, a
 * server-sent event stream whose "board" events carry the whole board whenever readings arrive
 * (at most every 2 s; a ": heartbeat" comment otherwise). Each event replaces the cached board,
 * so every screen reading `liveKeys.board()` follows the stream without polling.
 *
 * The stream needs the bearer token, which EventSource cannot send, so it is read with fetch()
 * and a ReadableStream and split into frames here (WHATWG HTML, "Server-sent events", §9.2.6
 * "Interpreting an event stream"). A dropped stream is reopened with a growing back-off.
 */
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { z } from 'zod';

import { config } from '@/constants/config';
import { useSession } from '@/hooks/session/SessionProvider';
import { apiRequest } from './client';

const id = z.union([z.string(), z.number()]).transform(String);
const nullableNumber = z.number().nullable();

export const liveTransmitterSchema = z.object({
  id,
  tag: z.string(),
  measures: z.string(),
  unit: z.string(),
  stackRole: z.string(),
  value: nullableNumber,
  time: z.string().nullable(),
  ageS: nullableNumber,
  shareOfSpan: nullableNumber,
});
export type LiveTransmitter = z.infer<typeof liveTransmitterSchema>;

export const liveBoardRowSchema = z.object({
  meterRunId: id,
  tag: z.string(),
  name: z.string(),
  siteCode: z.string(),
  timeZone: z.string(),
  massFlowKgPerS: nullableNumber,
  standardVolumeFlowM3PerS: nullableNumber,
  todayMassKg: z.number(),
  todayStandardVolumeM3: z.number(),
  todayEnergyJ: nullableNumber,
  todayStart: z.string(),
  activeTransmitterId: id.nullable(),
  activeStackRole: z.enum(['low', 'high', 'single']).nullable(),
  dpShareOfSpan: nullableNumber,
  freshnessS: nullableNumber,
  transmitters: z.array(liveTransmitterSchema),
  warnings: z.array(z.string()),
  /** Which way the meter run flows now (issue 13 §11); the rates above are positive either way. Absent from older servers. */
  direction: z.enum(['forward', 'reverse']).nullable().optional(),
});
export type LiveBoardRow = z.infer<typeof liveBoardRowSchema>;

const liveBoardRowsSchema = z.array(liveBoardRowSchema);

/**
 * The board as last received. Ages on it (`freshnessS`, `ageS`) were true at `receivedAtMs`;
 * the server sends a new board only when readings arrive, so a viewer adds the time since.
 */
export interface LiveBoard {
  rows: LiveBoardRow[];
  receivedAtMs: number;
}

export const liveKeys = {
  all: ['live'] as const,
  board: () => [...liveKeys.all, 'board'] as const,
};

/** One dispatched server-sent event. */
export interface ServerSentEvent {
  event: string;
  data: string;
}

/**
 * Splits a text/event-stream into events, chunk by chunk (a frame may arrive in pieces).
 * Comment lines (": heartbeat") and fields other than event and data are ignored.
 */
export class ServerSentEventParser {
  private buffer = '';
  private eventName = '';
  private dataLines: string[] = [];

  /**
   * @param chunk the next piece of decoded text
   * @returns the events completed by this piece, in order
   */
  push(chunk: string): ServerSentEvent[] {
    this.buffer += chunk;
    const events: ServerSentEvent[] = [];
    // Lines end in CRLF, LF or CR (§9.2.5). A CR at the very end may be half of a CRLF: wait.
    const pattern = /\r\n|\n|\r(?!$)/g;
    let start = 0;
    for (let match = pattern.exec(this.buffer); match; match = pattern.exec(this.buffer)) {
      const line = this.buffer.slice(start, match.index);
      start = match.index + match[0].length;
      const event = this.line(line);
      if (event) events.push(event);
    }
    this.buffer = this.buffer.slice(start);
    return events;
  }

  private line(line: string): ServerSentEvent | null {
    if (line === '') {
      // A blank line dispatches the event gathered so far; an event without data is dropped.
      const event = this.dataLines.length
        ? { event: this.eventName || 'message', data: this.dataLines.join('\n') }
        : null;
      this.eventName = '';
      this.dataLines = [];
      return event;
    }
    if (line.startsWith(':')) return null;
    const colon = line.indexOf(':');
    const field = colon === -1 ? line : line.slice(0, colon);
    let value = colon === -1 ? '' : line.slice(colon + 1);
    if (value.startsWith(' ')) value = value.slice(1);
    if (field === 'event') this.eventName = value;
    else if (field === 'data') this.dataLines.push(value);
    return null;
  }
}

/** The stream's state, for the board's connection line. */
export type LiveConnection =
  | { status: 'connecting' }
  | { status: 'live'; sinceMs: number }
  | { status: 'retrying'; retryAtMs: number; reason: string }
  /** This platform's fetch cannot stream (React Native without a stream body): the board is re-read now and then. */
  | { status: 'unsupported' };

/** First wait after a dropped stream; doubled after each failed try, up to the ceiling. */
const firstRetryMs = 1_000;
const maxRetryMs = 30_000;
/** The server sends something every 2 s; this long without a byte means the link is dead. */
const silenceLimitMs = 15_000;
/** How often the board is re-read while the stream is down. */
const fallbackRefetchMs = 15_000;

class StreamEnded extends Error {}

/**
 * Reads one connection of the stream until it ends or fails.
 * @param onBoard called with each board received
 * @param onOpen called once the server has answered 200
 */
async function readStreamOnce(
  token: string,
  signal: AbortSignal,
  onOpen: () => void,
  onBoard: (rows: LiveBoardRow[]) => void,
): Promise<'unsupported' | 'unauthorized'> {
  const attempt = new AbortController();
  const abortAttempt = () => attempt.abort();
  signal.addEventListener('abort', abortAttempt);
  let lastByteMs = Date.now();
  const watchdog = setInterval(() => {
    if (Date.now() - lastByteMs > silenceLimitMs) attempt.abort();
  }, silenceLimitMs / 3);
  try {
    const response = await fetch(`${config.apiBaseUrl}/live/stream`, {
      headers: { Authorization: `Bearer ${token}`, Accept: 'text/event-stream' },
      signal: attempt.signal,
      cache: 'no-store',
    });
    if (response.status === 401) return 'unauthorized';
    if (!response.ok) throw new StreamEnded(`the server answered ${response.status}`);
    if (!response.body || typeof response.body.getReader !== 'function') return 'unsupported';
    onOpen();
    const reader = response.body.getReader();
    const decoder = new TextDecoder();
    const parser = new ServerSentEventParser();
    for (;;) {
      const { done, value } = await reader.read();
      if (done) throw new StreamEnded('the server closed the stream');
      lastByteMs = Date.now();
      for (const event of parser.push(decoder.decode(value, { stream: true }))) {
        if (event.event !== 'board') continue;
        let json: unknown;
        try {
          json = JSON.parse(event.data);
        } catch {
          continue;
        }
        const parsed = liveBoardRowsSchema.safeParse(json);
        if (parsed.success) onBoard(parsed.data);
      }
    }
  } catch (cause) {
    if (signal.aborted) throw cause;
    if (cause instanceof StreamEnded) throw cause;
    throw new StreamEnded(attempt.signal.aborted ? 'no data for 15 s' : 'the connection dropped');
  } finally {
    clearInterval(watchdog);
    signal.removeEventListener('abort', abortAttempt);
  }
}

function wait(ms: number, signal: AbortSignal): Promise<void> {
  return new Promise((resolve) => {
    const timer = setTimeout(resolve, ms);
    signal.addEventListener('abort', () => {
      clearTimeout(timer);
      resolve();
    });
  });
}

/**
 * Keeps the live stream open while someone is signed in and writes each board into the cache.
 * @returns the stream's state
 */
export function useLiveStream(): LiveConnection {
  const queryClient = useQueryClient();
  const { state, signOut } = useSession();
  const token = state.status === 'signed-in' ? state.token : null;
  const [connection, setConnection] = useState<LiveConnection>({ status: 'connecting' });

  useEffect(() => {
    if (!token) return;
    const stop = new AbortController();
    const run = async () => {
      let retryMs = firstRetryMs;
      while (!stop.signal.aborted) {
        setConnection({ status: 'connecting' });
        let received = false;
        try {
          const outcome = await readStreamOnce(
            token,
            stop.signal,
            () => setConnection({ status: 'live', sinceMs: Date.now() }),
            (rows) => {
              received = true;
              queryClient.setQueryData<LiveBoard>(liveKeys.board(), { rows, receivedAtMs: Date.now() });
            },
          );
          if (outcome === 'unauthorized') {
            signOut('expired');
            return;
          }
          setConnection({ status: 'unsupported' });
          return;
        } catch (cause) {
          if (stop.signal.aborted) return;
          // A stream that delivered boards was healthy: start the back-off again from the bottom.
          if (received) retryMs = firstRetryMs;
          const reason = cause instanceof Error ? cause.message : 'the connection dropped';
          setConnection({ status: 'retrying', retryAtMs: Date.now() + retryMs, reason });
          await wait(retryMs, stop.signal);
          retryMs = Math.min(retryMs * 2, maxRetryMs);
        }
      }
    };
    void run();
    return () => stop.abort();
  }, [token, queryClient, signOut]);

  return connection;
}

/**
 * The live board: read once at first, then kept current by the stream.
 * @returns the board query and the stream's state
 */
export function useLiveBoard() {
  const connection = useLiveStream();
  const board = useQuery({
    queryKey: liveKeys.board(),
    queryFn: async ({ signal }): Promise<LiveBoard> => ({
      rows: await apiRequest({ path: '/live/board', schema: liveBoardRowsSchema, signal }),
      receivedAtMs: Date.now(),
    }),
    // While the stream is up it is the source; while it is down the board is re-read now and then.
    refetchInterval: connection.status === 'live' ? false : fallbackRefetchMs,
    staleTime: connection.status === 'live' ? Infinity : config.staleTimeMs,
  });
  return { board, connection };
}
