// Public exports of src/elevation/ (one line per file as files land).
export {};
