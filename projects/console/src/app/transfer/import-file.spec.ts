import { fileSize, importFileProblem, MAX_IMPORT_BYTES } from './import-file';

describe('importFileProblem', () => {
  it('lets .json and .csv files up to 1 MiB through, whatever the case of the extension', () => {
    expect(importFileProblem({ name: 'models.csv', size: 10 })).toBeNull();
    expect(importFileProblem({ name: 'Bundle.JSON', size: MAX_IMPORT_BYTES })).toBeNull();
  });

  it('refuses other types, empty files and files over the limit, naming the file', () => {
    expect(importFileProblem({ name: 'models.xlsx', size: 10 })).toBe('models.xlsx is not a .json bundle or a .csv file.');
    expect(importFileProblem({ name: 'empty.csv', size: 0 })).toBe('empty.csv is empty.');
    expect(importFileProblem({ name: 'big.csv', size: MAX_IMPORT_BYTES + 1 })).toBe('big.csv is 1.0 MiB; the import takes files up to 1.0 MiB. Split it into smaller files.');
  });

  it('words sizes in B, KiB and MiB', () => {
    expect(fileSize(512)).toBe('512 B');
    expect(fileSize(38_297)).toBe('37.4 KiB');
    expect(fileSize(3 * 1024 * 1024)).toBe('3.0 MiB');
  });
});
