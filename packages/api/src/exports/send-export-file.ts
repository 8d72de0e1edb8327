import { StreamableFile } from '@nestjs/common';
import type { Response } from 'express';
import { setAttachment } from '../common/content-disposition';
import type { ExportFile } from './exports.service';

/** Answers an export as a download under its file name (the fit's figures and tables, comparisons). */
export function sendExportFile(res: Response, file: ExportFile): StreamableFile {
  setAttachment(res, file.fileName);
  return new StreamableFile(file.body, { type: file.contentType, length: file.body.length });
}
