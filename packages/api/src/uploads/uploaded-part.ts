/** The part of multer's file object we read; named here because our tsconfig loads only Node's types. */
export interface UploadedPart {
  buffer: Buffer;
  originalname: string;
  mimetype: string;
  size: number;
}
