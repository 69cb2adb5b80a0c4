// Offers bytes to the browser as a file download: one place for every file the app hands over
// (spreadsheets, drawings, proposal PDFs, files the API sends).

/** Saves `data` through the browser's download as `fileName`. */
export function downloadBlob(fileName: string, data: Blob): void {
  const url = URL.createObjectURL(data);
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  document.body.append(link);
  link.click();
  link.remove();
  // Some browsers read the object URL after click() returns: let it go once they have.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}
