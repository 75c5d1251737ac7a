import { aRevisionSummary } from '../models/model-fixtures';
import { defaultPair, readPair, readShownRevision } from './revision-pair';

// newest first, as the API lists them
const THREE = [aRevisionSummary(3), aRevisionSummary(2), aRevisionSummary(1)];

describe('revision pair', () => {
  it('compares the latest two revisions by default, the older on the left', () => {
    expect(defaultPair(THREE)).toEqual({ from: 2, to: 3 });
    expect(defaultPair([aRevisionSummary(1), aRevisionSummary(2)])).toEqual({ from: 1, to: 2 });
  });

  it('has nothing to compare with a single revision', () => {
    expect(defaultPair([aRevisionSummary(1)])).toBeNull();
    expect(readPair({ from: '1', to: '1' }, [aRevisionSummary(1)])).toBeNull();
  });

  it('takes the pair from the URL when the model has both revisions', () => {
    expect(readPair({ from: '1', to: '3' }, THREE)).toEqual({ from: 1, to: 3 });
    expect(readPair({ from: '3', to: '1' }, THREE)).toEqual({ from: 3, to: 1 });
  });

  it('fills a missing or unknown side from the latest two', () => {
    expect(readPair({ from: '1' }, THREE)).toEqual({ from: 1, to: 3 });
    expect(readPair({ from: '9', to: '1' }, THREE)).toEqual({ from: 2, to: 1 });
    expect(readPair({ from: 'two', to: '2.5' }, THREE)).toEqual({ from: 2, to: 3 });
  });

  it('opens an older revision read-only, and treats the current one as no choice', () => {
    expect(readShownRevision({ revision: '1' }, THREE, 3)).toBe(1);
    expect(readShownRevision({ revision: '3' }, THREE, 3)).toBeNull();
    expect(readShownRevision({ revision: '7' }, THREE, 3)).toBeNull();
    expect(readShownRevision({}, THREE, 3)).toBeNull();
  });
});
