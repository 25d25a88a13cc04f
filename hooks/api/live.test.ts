/**
 * The event stream parser against the rules and examples of WHATWG HTML, "Server-sent events",
 * §9.2.5 (lines end in CRLF, LF or CR) and §9.2.6 "Interpreting an event stream".
 */
import { liveKeys, ServerSentEventParser } from './live';

describe('ServerSentEventParser', () => {
  it('joins data lines with newlines and dispatches on a blank line (the spec’s "YHOO" example)', () => {
    expect(new ServerSentEventParser().push('data: YHOO\ndata: +2\ndata: 10\n\n')).toEqual([
      { event: 'message', data: 'YHOO\n+2\n10' },
    ]);
  });

  it('names the event by its event field, and forgets the name after dispatch', () => {
    const parser = new ServerSentEventParser();
    expect(parser.push('event: board\ndata: []\n\ndata: next\n\n')).toEqual([
      { event: 'board', data: '[]' },
      { event: 'message', data: 'next' },
    ]);
  });

  it('ignores comment lines, such as the heartbeat, and fields it does not use', () => {
    expect(new ServerSentEventParser().push(': heartbeat\n\nid: 7\nretry: 1000\ndata: x\n\n')).toEqual([
      { event: 'message', data: 'x' },
    ]);
  });

  it('drops an event with no data', () => {
    expect(new ServerSentEventParser().push('event: board\n\n')).toEqual([]);
  });

  it('reads a field with no colon as an empty value, and a single newline from two (the spec’s "data" example)', () => {
    // The spec: the first block fires an event whose data is the empty string, the middle block
    // one whose data is a single newline; the last is not dispatched without a blank line.
    expect(new ServerSentEventParser().push('data\n\ndata\ndata\n\ndata:')).toEqual([
      { event: 'message', data: '' },
      { event: 'message', data: '\n' },
    ]);
  });

  it('strips one space after the colon and no more (the spec’s "data:test" example)', () => {
    expect(new ServerSentEventParser().push('data:test\n\ndata: test\n\ndata:  two\n\n')).toEqual([
      { event: 'message', data: 'test' },
      { event: 'message', data: 'test' },
      { event: 'message', data: ' two' },
    ]);
  });

  it('takes CRLF, LF and CR as line ends', () => {
    expect(new ServerSentEventParser().push('data: a\r\n\r\ndata: b\r\rdata: c\n\n')).toEqual([
      { event: 'message', data: 'a' },
      { event: 'message', data: 'b' },
      { event: 'message', data: 'c' },
    ]);
  });

  it('puts a frame split across chunks back together', () => {
    const parser = new ServerSentEventParser();
    expect(parser.push('event: bo')).toEqual([]);
    expect(parser.push('ard\ndata: {"rows"')).toEqual([]);
    expect(parser.push(':1}\n')).toEqual([]);
    expect(parser.push('\n')).toEqual([{ event: 'board', data: '{"rows":1}' }]);
  });

  it('waits on a CR at the end of a chunk, which may be half of a CRLF', () => {
    const parser = new ServerSentEventParser();
    expect(parser.push('data: a\r')).toEqual([]);
    // Had the CR been taken as a line end, this LF would be a blank line and dispatch "a" alone.
    expect(parser.push('\ndata: b\r')).toEqual([]);
    expect(parser.push('\n\r\n')).toEqual([{ event: 'message', data: 'a\nb' }]);
  });
});

describe('liveKeys', () => {
  it('keeps the board under the live root, so invalidating live reaches it', () => {
    expect(liveKeys.board().slice(0, liveKeys.all.length)).toEqual([...liveKeys.all]);
  });
});
