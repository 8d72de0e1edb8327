// The engine version written into every solution. It mirrors package.json's "version" (a test keeps the two
// equal) because reading package.json at run time would be I/O, which this package does not do.
export const ENGINE_VERSION = '0.1.0';
