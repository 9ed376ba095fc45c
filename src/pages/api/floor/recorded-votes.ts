import { parseQuery, requireActor, route } from "../../../lib/server/http.ts";
import { recordedVotes, recordedVotesQuerySchema } from "../../../lib/server/services/floor.ts";

/** The chamber's recorded votes as the floor record now stands: {votes: [{id, yea: [legislator ids], nay: [...], …}]}. */
export const GET = route(async ({ locals, url }) => recordedVotes(requireActor(locals, "chamber:read"), parseQuery(url, recordedVotesQuerySchema)));
