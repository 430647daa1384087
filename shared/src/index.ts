// Public surface of the shared package: schemas, domain types and pure computation used by
// both the portal and the server. Add a line here for each new module.
export * from './auth/role';
export * from './auth/auth.schema';
export * from './http/api-error';
export * from './http/page';
export * from './organisations/organisation.schema';
export * from './users/user.schema';
export * from './requests/us-state';
export * from './requests/nec-edition';
export * from './requests/request-status';
export * from './requests/days-to-closing';
export * from './requests/repair-request.schema';
export * from './requests/request-reference';
export * from './pricing/rounding';
export * from './pricing/rate-book.schema';
export * from './pricing/pricing-input.schema';
export * from './pricing/pricing-breakdown.schema';
export * from './pricing/pricing-error';
export * from './pricing/price-line';
export * from './pricing/price-visit';
export * from './pricing/price-quote';
export * from './pricing/verify-totals';
export * from './pricing/ballpark.schema';
export * from './pricing/ballpark';
export * from './pricing/demo-rate-book';
