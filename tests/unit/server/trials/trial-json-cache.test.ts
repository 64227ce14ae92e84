import { describe, expect, it } from 'vitest';
import { TrialJsonCache } from '@server/trials/trials.service.ts';

describe('TrialJsonCache', () => {
  it('drops the least recently used entry beyond its capacity', () => {
    const cache = new TrialJsonCache(2);
    cache.set('1:1:a', 'one');
    cache.set('2:1:b', 'two');
    expect(cache.get('1:1:a')).toBe('one'); // 1 is now the most recently used
    cache.set('3:1:c', 'three');
    expect(cache.size).toBe(2);
    expect(cache.get('2:1:b')).toBeUndefined();
    expect(cache.get('1:1:a')).toBe('one');
    expect(cache.get('3:1:c')).toBe('three');
  });

  it('replaces an entry set twice without growing', () => {
    const cache = new TrialJsonCache(2);
    cache.set('1:1:a', 'old');
    cache.set('1:1:a', 'new');
    expect(cache.size).toBe(1);
    expect(cache.get('1:1:a')).toBe('new');
  });
});
