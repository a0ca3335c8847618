// A file under /assets/ that the build does not have (the server's static handler passes it on):
// a plain 404 for anyone, not the sign-in redirect that the app's frame gives unknown pages.
export const loader = () => new Response("No such file.", { status: 404, headers: { "Content-Type": "text/plain; charset=utf-8" } });
