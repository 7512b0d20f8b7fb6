import { complain, type CommandIo } from '../io';

/** Placeholder until this command is built. */
export async function glycaemia(io: CommandIo): Promise<number> {
  return complain(io, 'glycaemia is not built yet');
}
