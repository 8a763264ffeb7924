// Public exports of src/geodesy/ (one line per file as files land).
export {};
