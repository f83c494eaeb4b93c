import { applyDecorators, StreamableFile, UseInterceptors } from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiBody, ApiConsumes, type SchemaObject } from '@nestjs/swagger';
import type { Response } from 'express';
import { ApiRefusal } from './openapi/api-responses.js';

/** A file answered as a download that no browser or proxy keeps: signed documents, extracts and exports. */
export function download(res: Response, body: Buffer, type: string, fileName: string): StreamableFile {
  res.setHeader('Cache-Control', 'private, no-store');
  return new StreamableFile(body, { type, disposition: `attachment; filename="${fileName}"`, length: body.length });
}

/** One file in the multipart form field `file`, bounded in bytes, with the other form fields named in `fields`. */
export function FileUpload(maxBytes: number, description: string, fields: Record<string, SchemaObject> = {}) {
  return applyDecorators(
    UseInterceptors(FileInterceptor('file', { limits: { fileSize: maxBytes, files: 1 } })),
    ApiConsumes('multipart/form-data'),
    ApiBody({
      schema: {
        type: 'object',
        required: ['file', ...Object.keys(fields)],
        properties: { file: { type: 'string', format: 'binary', description }, ...fields },
      },
    }),
    ApiRefusal(413, `The file is larger than ${maxBytes / 1024 / 1024} MB.`),
  );
}
