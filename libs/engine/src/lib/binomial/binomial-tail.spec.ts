import reference from '../../testing/fixtures/binomial-tail.json';
import { expectClose } from '../../testing/expect-close';
import { binomialTest } from './binomial-test';

// Reference values: tools/fixtures/binomial-tail-reference.py (mpmath, 40 digits; versions in the fixture).
describe('two-sided exact binomial test at any n', () => {
  it.each(reference.cases)('x = $x, n = $n, p = $p matches the beta-integral reference', ({ x, n, p, pValue, logP }) => {
    const result = binomialTest(x, n, p);
    expectClose(result.logP, logP, { relative: 1e-12, absolute: 1e-13 }, 'ln p');
    if (pValue > 0) expectClose(result.p, pValue, { relative: 1e-12 }, 'p');
    else expect(result.p).toBe(0);
  });
});
