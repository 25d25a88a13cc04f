import { notFound } from '../../errors';
import type { ReadingRepository } from './repository';
import type { ReadingsQuery } from './schema';

/**
 * Raw readings of a transmitter in its own unit, oldest first.
 * @throws not found when the transmitter does not exist
 */
export async function readingsForWindow(repository: ReadingRepository, request: ReadingsQuery) {
  if (!(await repository.transmitterExists(request.transmitterId))) throw notFound('Transmitter');
  return repository.readings(request.transmitterId, { from: request.from, to: request.to }, request.limit);
}
