import { describe, expect, it } from 'vitest';
import { splitLinks } from '../components/linkified-text';

describe('splitLinks', () => {
  it('makes web links clickable and leaves sentence punctuation outside', () => {
    expect(splitLinks('Set it here: http://localhost:3000/reset-password?token=abc. Thanks')).toEqual([
      { kind: 'text', text: 'Set it here: ' },
      { kind: 'link', href: 'http://localhost:3000/reset-password?token=abc' },
      { kind: 'text', text: '. Thanks' },
    ]);
  });

  it('never turns other schemes into links', () => {
    expect(splitLinks('javascript:alert(1) data:text/html,hi')).toEqual([{ kind: 'text', text: 'javascript:alert(1) data:text/html,hi' }]);
  });
});
