import { Router } from 'express';
import { z } from 'zod';
import { pageQuerySchema, uuidParam } from '../../../shared/schemas/common.js';
import type { MailMessage } from '../../../shared/schemas/mail.js';
import type { AppContext } from '../../context.js';
import { notFound } from '../../lib/http-error.js';
import { route } from '../../lib/route.js';
import { requireCoordinator } from '../../auth/guards.js';
import { getMailboxMessage, listMailbox } from './mail.repo.js';

export function mailRouter(ctx: AppContext): Router {
  const r = Router();
  r.use(requireCoordinator(ctx));

  r.get(
    '/status',
    route({}, () => ctx.mailer.describe()),
  );

  r.get(
    '/',
    route({ query: pageQuerySchema }, async ({ query }) => {
      const { items, total } = await listMailbox(ctx.db, query.page, query.pageSize);
      return {
        total,
        items: items.map(
          (m): MailMessage => ({
            id: m.id,
            from: m.fromAddress,
            to: m.toAddresses,
            subject: m.subject,
            receivedAt: m.receivedAt.toISOString(),
            textBody: m.textBody,
            htmlBody: m.htmlBody,
            attachments: m.attachments.map((a, index) => ({
              index,
              filename: a.filename,
              contentType: a.contentType,
              size: a.size,
            })),
          }),
        ),
      };
    }),
  );

  r.get(
    '/:id/attachments/:index',
    route(
      { params: z.object({ id: uuidParam, index: z.coerce.number().int().min(0) }) },
      async ({ params }, _req, res) => {
        const message = await getMailboxMessage(ctx.db, params.id);
        const att = message?.attachments[params.index];
        if (!att) throw notFound('That attachment');
        res.setHeader('Content-Type', att.contentType);
        res.setHeader('Content-Disposition', `attachment; filename="${att.filename.replace(/["\\\r\n]/g, '_')}"`);
        res.send(Buffer.from(att.contentBase64, 'base64'));
      },
    ),
  );
  return r;
}
