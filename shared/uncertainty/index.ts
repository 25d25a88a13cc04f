export * from './element-uncertainty';
export * from './flow-rate-uncertainty';
export * from './transmitter-uncertainty';
export * from './total-uncertainty';
