/**
 * The bucket's CORS rule for browser uploads straight to storage: the app's origins may
 * PUT, GET and HEAD with any header, and read the ETag (a browser completing a multipart
 * upload must send back each part's ETag).
 */
export const DEFAULT_APP_ORIGINS = ["http://127.0.0.1:3000", "http://localhost:3000"];

function escapeXml(text: string): string {
  return text.replace(/[<>&'"]/g, (ch) => `&#${ch.charCodeAt(0)};`);
}

export function corsConfigurationXml(origins: string[] = DEFAULT_APP_ORIGINS): string {
  if (origins.length === 0) throw new Error("at least one app origin is needed for the bucket's CORS rule");
  const originTags = origins.map((o) => `<AllowedOrigin>${escapeXml(o)}</AllowedOrigin>`).join("");
  return (
    `<CORSConfiguration><CORSRule>${originTags}` +
    "<AllowedMethod>PUT</AllowedMethod><AllowedMethod>GET</AllowedMethod><AllowedMethod>HEAD</AllowedMethod>" +
    "<AllowedHeader>*</AllowedHeader><ExposeHeader>ETag</ExposeHeader><MaxAgeSeconds>3000</MaxAgeSeconds>" +
    "</CORSRule></CORSConfiguration>"
  );
}
