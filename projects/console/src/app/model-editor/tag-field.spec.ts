import { tagOf } from './tag-field';

describe('tagOf', () => {
  it('lowercases and joins words with hyphens, as the API stores tags', () => {
    expect(tagOf(' Dead time ')).toEqual({ tag: 'dead-time', message: null });
    expect(tagOf('Belt_Tension')).toEqual({ tag: 'belt-tension', message: null });
    expect(tagOf('line-3')).toEqual({ tag: 'line-3', message: null });
  });

  it('says why a text cannot be a tag, with the rule', () => {
    expect(tagOf('ζ-0.4').message).toBe('"ζ-0.4" is not a tag: use lowercase words of a–z and 0–9 joined by single hyphens, e.g. dead-time.');
    expect(tagOf('a--b').message).toContain('joined by single hyphens');
    expect(tagOf('x'.repeat(41)).message).toBe(`"${'x'.repeat(41)}" has 41 characters; a tag has at most 40.`);
  });
});
