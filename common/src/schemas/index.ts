// Shared yup schemas: the same schema validates the web form and the API request.
export * from './limits';
export * from './auth';
export * from './member';
export * from './project';
export * from './study';
export * from './design';
export * from './brand';
export * from './billing';
export * from './takeoff';
export * from './search';
export * from './uncertainty';
export * from './version';
export * from './proposal';
export * from './priceBook';
export * from './estimateRevision';
