import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PressCardView } from '../../../../shared/schemas/workroom.ts';
import { api } from '../../../lib/api-client.ts';
import { workroomKeys } from './keys.ts';

/** Press cards for every line that is cut and waiting to be pressed. */
export const getPressCards = async (signal?: AbortSignal) => (await api.get<{ cards: PressCardView[] }>('/api/workroom/press-cards', { signal })).cards;
export const getPressCardsQueryOptions = () => queryOptions({ queryKey: workroomKeys.pressCards(), queryFn: ({ signal }) => getPressCards(signal) });
export const usePressCards = () => useQuery(getPressCardsQueryOptions());
