import { z } from 'zod';
import { AppError } from '../http/errors.js';
import { defineRoute, type RouteSpec } from '../http/route-table.js';
import { convertLog } from '../services/convert-service.js';
import { attachment, TRACK_FORMATS } from '../services/track-output.js';

const ConvertQuery = z.object({
  to: z.enum(TRACK_FORMATS).describe('The format to write'),
  from: z.enum(['gpx', 'csv', 'nmea', 'geojson', 'kml']).optional().describe('The input format; detected by default'),
  timeZone: z.string().min(1).max(64).optional().describe('IANA zone of local times in the log; UTC by default'),
  inputCrs: z.string().max(20).optional().describe('EPSG code of projected input coordinates'),
  crs: z.string().max(20).optional().describe('CSV only: also write coordinates in EPSG:<code>, or utm'),
});

/** The stateless converter for pipelines: a file in, the converted file out, nothing archived. */
export function createConvertRoutes(now: () => Date): RouteSpec[] {
  return [
    defineRoute({
      method: 'post',
      path: '/convert',
      summary: 'Convert one log (multipart field "file") to GPX, GeoJSON, CSV or KML; nothing is stored',
      tag: 'Convert',
      access: 'signed-in',
      query: ConvertQuery,
      upload: { field: 'file', maxFiles: 1 },
      responses: {
        200: { description: 'The converted file, as an attachment', contentType: 'application/octet-stream' },
        422: { description: 'Not a readable log, or a CRS the format cannot carry' },
      },
      handler({ query, files }, _req, res) {
        const [file] = files;
        if (file === undefined)
          throw new AppError('bad-request', 'Send the log as multipart/form-data in the field "file".');
        const converted = convertLog({
          fileName: file.originalname,
          content: file.buffer,
          to: query.to,
          from: query.from,
          timeZone: query.timeZone,
          inputCrs: query.inputCrs,
          crs: query.crs,
          nowMs: now().getTime(),
        });
        res.setHeader('Content-Type', converted.contentType);
        res.setHeader('Content-Disposition', attachment(converted.fileName));
        res.setHeader('X-Leadline-Fix-Count', String(converted.fixCount));
        res.setHeader('X-Leadline-Rejection-Count', String(converted.rejectionCount));
        res.send(converted.text);
      },
    }),
  ];
}
