import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import express from 'express';
import request from 'supertest';
import { errorMiddleware } from '../http/error-middleware';
import { receiveFile, receivedFile } from './model-upload';

describe('receiveFile', () => {
  let dir: string;
  beforeAll(async () => {
    dir = await mkdtemp(path.join(os.tmpdir(), 'taulens-upload-'));
  });
  afterAll(() => rm(dir, { recursive: true, force: true }));

  function app() {
    const a = express();
    a.post(
      '/upload',
      receiveFile({ dir, maxBytes: 1024, extensions: ['.ifc'], expected: 'an IFC file (.ifc)', refusedCode: 'not_ifc' }),
      (req, res) => {
        res.json({ name: receivedFile(req, 'an IFC file').originalName });
      },
    );
    a.use(errorMiddleware);
    return a;
  }

  // Browsers send a file name as raw UTF-8 in Content-Disposition without a charset (HTML Living Standard,
  // multipart/form-data encoding algorithm; from memory), as supertest does here.
  it.each(['Träger_Überbau_钢梁.ifc', 'קורה-ראשית.ifc', 'ＡＢＣ梁.ifc'])('keeps the non-ASCII file name %s', async (name) => {
    const response = await request(app()).post('/upload').attach('file', Buffer.from('ISO-10303-21;'), name).expect(200);
    expect(response.body.name).toBe(name);
  });

  it('names a refused file correctly too', async () => {
    const response = await request(app()).post('/upload').attach('file', Buffer.from('x'), 'Stützen.txt').expect(400);
    expect(response.body.error.message).toBe("'Stützen.txt' is not an IFC file (.ifc).");
  });
});
