// Public exports of src/readings/ (one line per file as files land).
export {};
