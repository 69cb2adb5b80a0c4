// Results out to a spreadsheet: the rows of an export, in the project's units, with its header.
export {
  EXPORT_CAUTION,
  columnHeading,
  exportFileName,
  exportHeader,
  neutralise,
  sheetRows,
  toDecimals,
  unitSystemName,
  unneutralise,
  type ExportColumn,
  type ExportContext,
  type ExportTable,
  type SheetCell,
} from './table';
