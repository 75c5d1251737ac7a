import { fileNameFrom, saveBlob } from './save-file';

describe('fileNameFrom', () => {
  it('reads the quoted, bare and UTF-8 forms of Content-Disposition', () => {
    expect(fileNameFrom('attachment; filename="polewright-models-2026-12-02.json"', 'x.json')).toBe('polewright-models-2026-12-02.json');
    expect(fileNameFrom('attachment; filename=models.json', 'x.json')).toBe('models.json');
    expect(fileNameFrom(`attachment; filename="models.json"; filename*=UTF-8''Modelle%20L%C3%BCfter.json`, 'x.json')).toBe('Modelle Lüfter.json');
  });

  it('falls back when there is no name, and never keeps a path', () => {
    expect(fileNameFrom(null, 'polewright-models.json')).toBe('polewright-models.json');
    expect(fileNameFrom('attachment', 'polewright-models.json')).toBe('polewright-models.json');
    expect(fileNameFrom('attachment; filename="../../etc/passwd"', 'x')).toBe('.._.._etc_passwd');
  });
});

describe('saveBlob', () => {
  it('clicks a temporary link to an object URL of the blob with the file name', () => {
    const clicks: { href: string; download: string }[] = [];
    URL.createObjectURL = vi.fn(() => 'blob:http://localhost/file');
    URL.revokeObjectURL = vi.fn();
    const click = vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      clicks.push({ href: this.href, download: this.download });
    });
    saveBlob(new Blob(['{}'], { type: 'application/json' }), 'models.json');
    expect(clicks).toEqual([{ href: 'blob:http://localhost/file', download: 'models.json' }]);
    expect(document.querySelector('a[download]')).toBeNull();
    click.mockRestore();
  });
});
