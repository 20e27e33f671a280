import { readAddresses } from './share-addresses';

describe('readAddresses', () => {
  it('reads addresses separated by commas, semicolons or spaces, once each', () => {
    expect(readAddresses('ana@example.org, Bo@Example.org; bo@example.org\ncy@example.net')).toEqual({
      ok: true,
      addresses: ['ana@example.org', 'bo@example.org', 'cy@example.net'],
    });
  });

  it('names what is not an address', () => {
    expect(readAddresses('ana@example.org, bob, cy@')).toEqual({ ok: false, message: '“bob”, “cy@” are not e-mail addresses.' });
    expect(readAddresses('   ')).toEqual({ ok: false, message: 'Give at least one e-mail address.' });
  });

  it('limits how many people one share reaches', () => {
    const many = Array.from({ length: 21 }, (_, index) => `p${index}@example.org`).join(',');
    expect(readAddresses(many)).toEqual({ ok: false, message: 'Share with at most 20 addresses at a time.' });
  });
});
