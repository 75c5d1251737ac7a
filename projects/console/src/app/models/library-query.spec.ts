import { DEFAULT_LIBRARY_QUERY, isFiltered, libraryQueryParams, listQuery, readLibraryQuery } from './library-query';

describe('library query', () => {
  it('reads an empty URL as the default view: newest change first, page 1 of 25', () => {
    expect(readLibraryQuery({})).toEqual(DEFAULT_LIBRARY_QUERY);
    expect(libraryQueryParams(DEFAULT_LIBRARY_QUERY)).toEqual({});
  });

  it('gives each sort its natural order when the URL names none', () => {
    expect(readLibraryQuery({ sort: 'name' }).order).toBe('asc');
    expect(readLibraryQuery({ sort: 'createdAt' }).order).toBe('desc');
    expect(readLibraryQuery({ sort: 'name', order: 'desc' }).order).toBe('desc');
  });

  it('falls back to defaults for values a hand-edited link gets wrong', () => {
    const query = readLibraryQuery({ sort: 'colour', order: 'up', page: '-2', pageSize: '5000', includeDeleted: 'yes', q: '  belt  ', tag: 'Conveyor' });
    expect(query).toEqual({ ...DEFAULT_LIBRARY_QUERY, q: 'belt', tag: 'conveyor' });
  });

  it('writes only what differs from the defaults into the URL, and reads it back unchanged', () => {
    const query = { q: 'belt', tag: 'conveyor', sort: 'name' as const, order: 'desc' as const, page: 3, pageSize: 10, includeDeleted: true };
    const params = libraryQueryParams(query);
    expect(params).toEqual({ q: 'belt', tag: 'conveyor', sort: 'name', order: 'desc', page: '3', pageSize: '10', includeDeleted: 'true' });
    expect(readLibraryQuery(params)).toEqual(query);
    expect(libraryQueryParams({ ...DEFAULT_LIBRARY_QUERY, sort: 'name', order: 'asc' })).toEqual({ sort: 'name' });
  });

  it('leaves empty filters out of the API call', () => {
    expect(listQuery(DEFAULT_LIBRARY_QUERY)).toEqual({ q: undefined, tag: undefined, sort: 'updatedAt', order: 'desc', page: 1, pageSize: 25, includeDeleted: undefined });
  });

  it('counts text and tag as filters, not sort or paging', () => {
    expect(isFiltered({ ...DEFAULT_LIBRARY_QUERY, sort: 'name', page: 4, includeDeleted: true })).toBe(false);
    expect(isFiltered({ ...DEFAULT_LIBRARY_QUERY, q: 'x' })).toBe(true);
    expect(isFiltered({ ...DEFAULT_LIBRARY_QUERY, tag: 'speed' })).toBe(true);
  });
});
