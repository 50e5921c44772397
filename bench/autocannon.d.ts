// autocannon ships no types; the benchmark reads only a few numeric fields of its result.
declare module 'autocannon';
