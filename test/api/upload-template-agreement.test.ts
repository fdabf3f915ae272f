/**
 * The upload page keeps its own copy of the template's columns (to map headers
 * and check the first rows before sending); the server's list is the rule. This
 * test fails as soon as the two lists part, so the copy cannot drift.
 */
import { expect } from 'chai';
import * as server from '../../api/src/coupons/csv-template.ts';
import * as client from '../../client/src/app/pages/test-data/upload/template-fields.ts';

describe('upload template: the client\'s copy of the columns agrees with the server\'s', () => {
  it('has the same fields in the same order, each of the same kind, requirement, dimension and sign rule', () => {
    const shape = (f: { field: string; kind: string; required: boolean; dimension: string; positive?: boolean }) =>
      ({ field: f.field, kind: f.kind, required: f.required, dimension: f.dimension, positive: f.positive === true });
    expect(client.TEMPLATE_FIELDS.map(shape)).to.deep.equal(server.TEMPLATE_FIELDS.map(shape));
  });

  it('asks for the same result fields (at least one per row)', () => {
    expect([...client.RESULT_FIELDS]).to.deep.equal([...server.RESULT_FIELDS]);
  });
});
