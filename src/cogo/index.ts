// Public exports of src/cogo/ (one line per file as files land).
export {};
