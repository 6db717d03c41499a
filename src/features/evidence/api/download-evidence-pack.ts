/** The zip is fetched by the browser itself (a plain link), so large packs stream straight to disk. */
export function evidencePackDownloadHref(id: number): string {
  return `/api/v1/evidence-packs/${id}/download`;
}
