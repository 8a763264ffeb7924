// Public exports of src/uncertainty/ (one line per file as files land).
export {};
