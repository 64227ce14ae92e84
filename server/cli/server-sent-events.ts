/** One event of a server-sent event stream: its name (`message` when unnamed) and data. */
export interface ServerSentEvent {
  event: string;
  data: string;
}

/**
 * Reads a `text/event-stream` body into events, as the HTML Living Standard's "Server-sent
 * events" section describes the format: lines `field: value`, an empty line ends an event,
 * lines starting with `:` are comments, several `data` lines are joined with newlines. Fields
 * other than `event` and `data` (`id`, `retry`) are of no use here and are skipped.
 */
export async function* readServerSentEvents(
  body: ReadableStream<Uint8Array>,
): AsyncGenerator<ServerSentEvent> {
  const decoder = new TextDecoder();
  let buffer = '';
  let event = '';
  let data: string[] = [];
  const reader = body.getReader();
  try {
    for (;;) {
      const { value, done } = await reader.read();
      buffer += done ? decoder.decode() : decoder.decode(value, { stream: true });
      const lines = buffer.split(/\r\n|\r|\n/);
      // The last piece may be a line still arriving; keep it for the next chunk.
      buffer = done ? '' : (lines.pop() ?? '');
      for (const line of lines) {
        if (line === '') {
          if (data.length > 0) yield { event: event || 'message', data: data.join('\n') };
          event = '';
          data = [];
          continue;
        }
        if (line.startsWith(':')) continue;
        const colon = line.indexOf(':');
        const field = colon === -1 ? line : line.slice(0, colon);
        const raw = colon === -1 ? '' : line.slice(colon + 1);
        const text = raw.startsWith(' ') ? raw.slice(1) : raw;
        if (field === 'event') event = text;
        else if (field === 'data') data.push(text);
      }
      if (done) return;
    }
  } finally {
    reader.releaseLock();
  }
}
