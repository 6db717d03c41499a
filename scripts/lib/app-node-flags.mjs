// Flags of the app's Node.js processes, given by `npm start` and by the benchmark (to the app it
// starts, and to its own processes: one of them builds the evidence pack as the app's job runner does).
//
// --max-semi-space-size=32 (MB, default 16): a larger young generation. Building an evidence pack allocates
// hundreds of short-lived objects per row (exceljs's cells and XML pieces); with the default young
// generation many survive into the old generation and cost full collections. Measured on the
// benchmark's 100k-motor pack: 21.0-23.5 s instead of 23.0-30.4 s, the bare write beside it
// unchanged, peak memory 369-371 MB instead of 328-334 MB.
export const appNodeFlags = ['--max-semi-space-size=32'];
