import { describe, expect, it } from 'vitest';
import { readServerSentEvents } from '@server/cli/server-sent-events.ts';

/** A body delivered in exactly these chunks. */
function body(chunks: string[]): ReadableStream<Uint8Array> {
  const encoder = new TextEncoder();
  return new ReadableStream({
    start(controller) {
      for (const chunk of chunks) controller.enqueue(encoder.encode(chunk));
      controller.close();
    },
  });
}

async function collect(chunks: string[]) {
  const events = [];
  for await (const event of readServerSentEvents(body(chunks))) events.push(event);
  return events;
}

// Format from the HTML Living Standard, "Server-sent events", §9.2.5 "Parsing an event stream".
describe('readServerSentEvents', () => {
  it('reads named events, skips comments and retry, and joins data lines', async () => {
    const events = await collect([
      'retry: 2000\n\n',
      'event: progress\ndata: {"a":1}\n\n',
      ': still running\n\n',
      'data: first\ndata: second\n\n',
    ]);
    expect(events).toEqual([
      { event: 'progress', data: '{"a":1}' },
      { event: 'message', data: 'first\nsecond' },
    ]);
  });

  it('puts together lines and characters split across chunks, and CRLF line ends', async () => {
    const data = '{"status":"completed","note":"κ·u"}';
    const bytes = new TextEncoder().encode(`event: finished\r\ndata: ${data}\r\n\r\n`);
    // Cut inside the first line, and between the two bytes of κ.
    const kappa = bytes.indexOf(0xce);
    const stream = new ReadableStream<Uint8Array>({
      start(controller) {
        for (const c of [bytes.slice(0, 7), bytes.slice(7, kappa + 1), bytes.slice(kappa + 1)])
          controller.enqueue(c);
        controller.close();
      },
    });
    const events = [];
    for await (const event of readServerSentEvents(stream)) events.push(event);
    expect(events).toEqual([{ event: 'finished', data }]);
  });

  it('drops an event the stream ends in the middle of', async () => {
    expect(
      await collect(['event: progress\ndata: {"a":1}\n\nevent: progress\ndata: {"a"']),
    ).toEqual([{ event: 'progress', data: '{"a":1}' }]);
  });
});
