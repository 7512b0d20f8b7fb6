import { complain, type CommandIo } from '../io';

/** Placeholder until this command is built. */
export async function table(io: CommandIo): Promise<number> {
  return complain(io, 'table is not built yet');
}
