// The page policy of docs/decisions/010-headers.md, written out by hand as
// the decision states it, for the unit, integration and e2e checks of the
// headers. One line on purpose: it is the oracle, not a copy of the code.
export const expectedPagePolicy = (nonce: string, signInOrigin: string): string =>
  `default-src 'self'; script-src 'self' 'nonce-${nonce}'; style-src 'self'; style-src-attr 'unsafe-inline'; img-src 'self' data:; object-src 'none'; base-uri 'self'; form-action 'self' ${signInOrigin}; frame-ancestors 'none'`;
