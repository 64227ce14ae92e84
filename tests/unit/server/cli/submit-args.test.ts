import { describe, expect, it } from 'vitest';
import { defaultServerUrl, parseSubmitArgs, UsageError } from '@server/cli/submit-args.ts';

const env = { STABLEHAND_TOKEN: 'shk_test' };

describe('parseSubmitArgs', () => {
  it('reads the kernel, the routine and the options', () => {
    const options = parseSubmitArgs(
      [
        'lu.ts',
        '--routine',
        'frame-analysis/dense-lu',
        '--title',
        ' Blocked LU ',
        '--description',
        'Panels of 32',
      ],
      env,
    );
    expect(options).toEqual({
      kernelPath: 'lu.ts',
      teamSlug: 'frame-analysis',
      routineSlug: 'dense-lu',
      title: 'Blocked LU',
      description: 'Panels of 32',
      serverUrl: defaultServerUrl,
      candidateId: undefined,
      token: 'shk_test',
    });
  });

  it('takes the server from --server, else STABLEHAND_URL, without a trailing slash', () => {
    const args = ['lu.ts', '--routine', 'ab/cd'];
    expect(
      parseSubmitArgs(args, { ...env, STABLEHAND_URL: 'http://127.0.0.1:41000/' }).serverUrl,
    ).toBe('http://127.0.0.1:41000');
    expect(
      parseSubmitArgs([...args, '--server', 'https://review.example.test/'], {
        ...env,
        STABLEHAND_URL: 'http://127.0.0.1:41000',
      }).serverUrl,
    ).toBe('https://review.example.test');
  });

  it('reads --candidate as an id', () => {
    expect(
      parseSubmitArgs(['lu.ts', '--routine', 'ab/cd', '--candidate', '42'], env).candidateId,
    ).toBe(42);
  });

  it.each([
    [[], 'Give exactly one kernel file.'],
    [['a.ts', 'b.ts', '--routine', 'ab/cd'], 'Give exactly one kernel file.'],
    [['lu.ts'], '--routine <team-slug>/<routine-slug> is required.'],
    [['lu.ts', '--routine', 'dense-lu'], '--routine must be <team-slug>/<routine-slug>'],
    [['lu.ts', '--routine', 'ab/cd/ef'], '--routine must be'],
    [['lu.ts', '--routine', 'Frame/LU'], '--routine must be'],
    [['lu.ts', '--routine', 'ab/cd', '--candidate', '0'], '--candidate must be'],
    [['lu.ts', '--routine', 'ab/cd', '--candidate', '1.5'], '--candidate must be'],
    [['lu.ts', '--routine', 'ab/cd', '--candidate', '3', '--title', 'x'], 'a revision has neither'],
    [['lu.ts', '--routine', 'ab/cd', '--title', '  '], '--title must not be empty'],
    [['lu.ts', '--routine', 'ab/cd', '--server', 'not a url'], '--server must be a URL'],
    [['lu.ts', '--routine', 'ab/cd', '--server', 'ftp://127.0.0.1/'], 'http or https'],
    [['lu.ts', '--routine', 'ab/cd', '--fast'], "Unknown option '--fast'"],
    [['lu.ts', '--routine'], "Option '--routine <value>' argument missing"],
  ])('refuses %j', (args, message) => {
    expect(() => parseSubmitArgs(args, env)).toThrow(UsageError);
    expect(() => parseSubmitArgs(args, env)).toThrow(message);
  });

  it('needs STABLEHAND_TOKEN', () => {
    for (const token of [undefined, '', '   ']) {
      expect(() =>
        parseSubmitArgs(['lu.ts', '--routine', 'ab/cd'], { STABLEHAND_TOKEN: token }),
      ).toThrow('Set STABLEHAND_TOKEN');
    }
  });

  it('asks for the usage alone on --help', () => {
    expect(() => parseSubmitArgs(['--help'], env)).toThrow(new UsageError(''));
  });
});
