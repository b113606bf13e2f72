import useSWR from "swr";
import { useServerList } from "@/components/ui/use-server-list";
import type { listMaterials } from "@/db/queries/materials";
import type { Material, MaterialKind } from "@/lib/formulation";
import { apiSend, fetcher } from "./fetcher";
import type { ApiData } from "./json";

/** A material of the team's library, as GET /api/materials sends it. */
export type LibraryMaterial = ApiData<typeof listMaterials>["rows"][number];

/** The library as the formulation editor loads it: every material, by name (the API's largest page). */
const LIBRARY_URL = "/api/materials?pageSize=500&sort=name";

/** The team's materials, searched, filtered by kind, sorted and paged by the API. */
export function useMaterials(filter: { kind?: MaterialKind }) {
  return useServerList<LibraryMaterial>("/api/materials", { kind: filter.kind }, [{ id: "name", desc: false }]);
}

/** The whole library at once, for the editor's material pickers. */
export function useLibrary() {
  return useSWR<{ rows: LibraryMaterial[] }>(LIBRARY_URL, fetcher);
}

/** The body every material change sends: the engine's record and its CAS number. */
export interface MaterialBody {
  material: Material;
  casNumber: string | null;
}

/** Adds a material to the library (409 when the team has the name). */
export function createMaterial(body: MaterialBody) {
  return apiSend<LibraryMaterial>("POST", "/api/materials", body);
}

/** Changes a library material. */
export function updateMaterial(id: string, body: MaterialBody) {
  return apiSend<LibraryMaterial>("PUT", `/api/materials/${id}`, body);
}

/** Removes a library material (revisions keep their own copies). */
export function deleteMaterial(id: string) {
  return apiSend("DELETE", `/api/materials/${id}`);
}
