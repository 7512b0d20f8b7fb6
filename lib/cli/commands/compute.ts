import { complain, type CommandIo } from '../io';

/** Placeholder until this command is built. */
export async function compute(io: CommandIo): Promise<number> {
  return complain(io, 'compute is not built yet');
}
