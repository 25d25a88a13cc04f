export * from './defining-constants';
export * from './pressure-units';
export * from './other-units';
export * from './convert-units';
