export * from './common';
export * from './people';
export * from './records';
export * from './calculations';
export * from './activity';
export * from './guides';
export * from './sync';
export * from './imports';
