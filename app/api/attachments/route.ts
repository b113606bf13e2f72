import { createAttachment, findOwner, listAttachments } from "@/db/queries/attachments";
import { ApiError, notFound, route } from "@/lib/api";
import type { Permission } from "@/lib/permissions";
import { requireContext } from "@/lib/session";
import { attachmentKindSchema, attachmentOwnerSchema } from "@/lib/spreadsheet/api-schemas";
import { MAX_PDF_BYTES, pdfProblem } from "@/lib/spreadsheet/pdf";
import { readUploadedFile } from "@/lib/spreadsheet/upload";
import { parseQuery } from "@/lib/validations/api";

const READ: Record<"material" | "batch", Permission> = { material: "material:read", batch: "batch:read" };
const WRITE: Record<"material" | "batch", Permission> = { material: "material:update", batch: "batch:update" };

/** GET /api/attachments?ownerType=material|batch&ownerId=… : the owner's attachments. */
export const GET = route(async (req) => {
  await requireContext(req.headers);
  const { ownerType, ownerId } = parseQuery(req.url, attachmentOwnerSchema);
  const ctx = await requireContext(req.headers, READ[ownerType]);
  if (!(await findOwner(ctx.teamId, ownerType, ownerId))) throw notFound(ownerType === "material" ? "material" : "batch record");
  return Response.json(await listAttachments(ctx.teamId, ownerType, ownerId));
});

/**
 * POST /api/attachments (multipart: file, ownerType, ownerId, kind = sds | coa | other; the three may also be query parameters):
 * stores a PDF (checked by content, at most 10 MB) for a material or an open batch record.
 */
export const POST = route(async (req) => {
  // ownerType may come as ?ownerType= too, so the permission is checked before the body is read.
  const early = attachmentOwnerSchema.shape.ownerType.safeParse(new URL(req.url).searchParams.get("ownerType"));
  await requireContext(req.headers, early.success ? WRITE[early.data] : undefined);
  const upload = await readUploadedFile(req, MAX_PDF_BYTES);
  const query = Object.fromEntries(new URL(req.url).searchParams.entries());
  const owner = attachmentOwnerSchema.safeParse({ ...query, ...upload.fields });
  if (!owner.success) {
    const issue = owner.error.issues[0]!;
    throw new ApiError(422, "invalid_input", issue.message, { [String(issue.path[0] ?? "ownerType")]: issue.message });
  }
  const kind = attachmentKindSchema.safeParse(upload.fields.kind ?? query.kind ?? "other");
  if (!kind.success) throw new ApiError(422, "invalid_input", kind.error.issues[0]!.message, { kind: kind.error.issues[0]!.message });
  const ctx = await requireContext(req.headers, WRITE[owner.data.ownerType]);
  const problem = pdfProblem(upload.bytes);
  if (problem) throw new ApiError(415, "not_a_pdf", problem, { file: problem });
  const fileName = /\.pdf$/i.test(upload.fileName) ? upload.fileName : `${upload.fileName}.pdf`;
  const created = await createAttachment(ctx, { ...owner.data, kind: kind.data, fileName, contentType: "application/pdf", bytes: upload.bytes });
  return Response.json(created, { status: 201 });
});
