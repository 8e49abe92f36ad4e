/** `Content-Disposition: attachment` with a plain ASCII name and the exact name in RFC 5987 form. */
export function attachmentHeader(fileName: string): string {
  const plain = fileName.replace(/[^\x20-\x7e]|["\\]/g, '_');
  return `attachment; filename="${plain}"; filename*=UTF-8''${encodeURIComponent(fileName)}`;
}
