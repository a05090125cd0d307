import { commentSchema } from "../../shared/slate/schemas";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import { addComment, listComments, type CommentDeps } from "./comments.service";

const comments = "/api/channels/:channelId/episodes/:episodeId/comments";

/** An episode's comments, with mentions mailed through the job queue: everyone writes them. */
export function commentRoutes(commentDeps: CommentDeps): RouteSpec[] {
  const db = commentDeps.db;
  return [
    {
      method: "get",
      path: comments,
      access: channelAccess("comments", "R"),
      handler: async (req, res) => {
        res.json({ comments: await listComments(db, callerOf(req).channelId, idOf(req, "episodeId")) });
      },
    },
    {
      method: "post",
      path: comments,
      access: channelAccess("comments", "W"),
      handler: async (req, res) => {
        const episodeId = idOf(req, "episodeId");
        const { body } = parseBody(commentSchema, req.body);
        const comment = await addComment(commentDeps, callerOf(req), episodeId, body);
        res.status(201).json({ comment });
      },
    },
  ];
}
