// An address under /api/ that no endpoint answers: a JSON 404 for any method, so a client with a
// mistyped path reads an error it can parse, not the sign-in page's redirect or HTML.
const notFound = () => Response.json({ error: "no API endpoint at this address; see the README's API section" }, { status: 404 });

export const loader = notFound;
export const action = notFound;
