import { can } from "@/lib/permissions";

/** What the viewer may do with a revision, worked out on the server from their role. */
export interface Abilities {
  userId: string;
  update: boolean;
  submit: boolean;
  review: boolean;
  release: boolean;
  archive: boolean;
  readUnreleased: boolean;
}

/** The viewer's abilities from their role in the team (the server checks each action again). */
export function abilitiesOf(userId: string, role: string): Abilities {
  return {
    userId,
    update: can(role, "formulation:update"),
    submit: can(role, "formulation:submit"),
    review: can(role, "formulation:review"),
    release: can(role, "formulation:release"),
    archive: can(role, "formulation:archive"),
    readUnreleased: can(role, "formulation:readUnreleased"),
  };
}
