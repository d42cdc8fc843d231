export * from './domain-events';
export { createEventDispatcher, type EventDispatcher, type Subscriber } from './dispatcher';
export { announceCommitted, domainEventsOf, recordEffect } from './after-commit';
