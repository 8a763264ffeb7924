// jstat ships no types; the tests use it as an independent check only.
declare module 'jstat';
