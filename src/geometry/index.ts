// Public exports of src/geometry/ (one line per file as files land).
export {};
