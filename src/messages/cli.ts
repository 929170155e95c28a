/**
 * The words of the command line about files and arguments. Plain words: what is wrong,
 * where, and what to do.
 */
const MB = 1024 * 1024;
const size = (bytes: number): string => (bytes >= MB ? `${(bytes / MB).toFixed(bytes >= 10 * MB ? 0 : 1)} MB` : `${bytes} bytes`);
const capital = (s: string): string => s.charAt(0).toUpperCase() + s.slice(1);

export const cliMsg = {
  noSuchFile: (what: string, path: string) => `${capital(what)} ${path} does not exist.`,
  permissionDenied: (what: string, path: string) => `${capital(what)} ${path} cannot be read (permission denied).`,
  isFolder: (what: string, path: string) => `${capital(what)} ${path} is a folder, not a file.`,
  unreadable: (what: string, path: string, detail: string) => `${capital(what)} ${path} cannot be read: ${detail}`,
  notRegular: (what: string, path: string) =>
    `${capital(what)} ${path} is not a regular file (a device, a pipe or a socket), so it is not read.`,
  tooLarge: (what: string, path: string, limit: number) =>
    `${capital(what)} ${path} is larger than the ${size(limit)} that Furrow reads. Split the data, or keep the measurements the analysis needs.`,
  notUtf8: (what: string, path: string) => `${capital(what)} ${path} is not UTF-8 text.`,
  outsideFolder: (name: string) =>
    `${name} leads outside the document's folder (through a link), so it is not read: a document may read only files in its own folder.`,
} as const;
