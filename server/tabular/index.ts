/** Reading data files (CSV, semicolon- or tab-delimited text, .xlsx) into the engine's RawTable. */
export { readTableBytes, readTableFile, detectFormat, decodeText, type TableFormat } from './read-table';
export { readXlsxTable } from './xlsx-table';
