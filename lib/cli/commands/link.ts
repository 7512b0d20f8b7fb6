import { complain, type CommandIo } from '../io';

/** Placeholder until this command is built. */
export async function link(io: CommandIo): Promise<number> {
  return complain(io, 'link is not built yet');
}
