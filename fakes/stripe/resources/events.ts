// /v1/events: list (optionally by type) and retrieve.
import { z } from 'zod';
import type { Handler } from '../api.ts';
import { listOf, withExpand } from '../lists.ts';
import { listQuery, retrieveSchema, validate } from '../params.ts';

const listEventsSchema = z.object({ ...listQuery, type: z.string().optional() });

export const listEvents: Handler = (fake, call) => {
  const q = validate(listEventsSchema, call.params);
  return listOf(
    fake.store,
    fake.store.all('events').filter((e) => !q.type || e.type === q.type),
    '/v1/events',
    q,
  );
};

export const retrieveEvent: Handler = (fake, call) => {
  const q = validate(retrieveSchema, call.params);
  return withExpand(fake.store, fake.store.mustGet('events', call.id, 'event'), q.expand);
};
