// Moved to src/shared/policies/field-records.ts (issue 12, item 8). This re-export keeps branches in flight building;
// it goes once they have landed.
export * from '../../../src/shared/policies/field-records';
