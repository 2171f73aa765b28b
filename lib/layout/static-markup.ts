import type { ReactNode } from "react";

/**
 * Serializes a tree of plain elements and hook-free function components to markup.
 *
 * Why not react-dom/server's renderToStaticMarkup: Next.js refuses `react-dom/server` in
 * server components and route handlers (the React Server Components build resolves it to a
 * module that throws), and the PDF map is made in a route handler. The map is only SVG
 * elements and function components without hooks, so this small walk suffices; a test
 * checks its output is identical to renderToStaticMarkup for the plot map.
 */
export function renderStaticMarkup(node: ReactNode): string {
  if (node === null || node === undefined || typeof node === "boolean") return "";
  if (typeof node === "string" || typeof node === "number" || typeof node === "bigint") return escapeText(String(node));
  if (Array.isArray(node)) return node.map(renderStaticMarkup).join("");
  if (typeof node !== "object" || !("type" in node) || !("props" in node)) {
    throw new Error("renderStaticMarkup handles elements, strings, numbers and arrays only");
  }
  const { type, props } = node as { type: unknown; props: Record<string, unknown> };
  if (typeof type === "function") {
    if (type.prototype?.isReactComponent) throw new Error("renderStaticMarkup does not render class components");
    return renderStaticMarkup((type as (props: Record<string, unknown>) => ReactNode)(props));
  }
  if (type === Symbol.for("react.fragment")) return renderStaticMarkup(props.children as ReactNode);
  if (typeof type !== "string") throw new Error("renderStaticMarkup cannot render this element type");

  let attributes = "";
  let inner: string | null = null;
  for (const [name, value] of Object.entries(props)) {
    if (name === "children" || name === "key" || name === "ref") continue;
    if (name === "dangerouslySetInnerHTML") {
      inner = (value as { __html: string }).__html;
      continue;
    }
    if (value === null || value === undefined || value === false || typeof value === "function") continue;
    if (name === "style") throw new Error("renderStaticMarkup does not serialize style objects; use attributes");
    attributes += ` ${attributeName(name)}="${escapeText(value === true ? "" : String(value))}"`;
  }
  const children = inner ?? renderStaticMarkup(props.children as ReactNode);
  return voidElements.has(type) ? `<${type}${attributes}/>` : `<${type}${attributes}>${children}</${type}>`;
}

const voidElements = new Set(["area", "base", "br", "col", "embed", "hr", "img", "input", "link", "meta", "source", "track", "wbr"]);

/** SVG attributes whose names really are camelCase; React passes these through unchanged. */
const camelCaseSvgAttributes = new Set([
  "viewBox",
  "preserveAspectRatio",
  "patternUnits",
  "patternContentUnits",
  "patternTransform",
  "gradientUnits",
  "gradientTransform",
  "markerWidth",
  "markerHeight",
  "markerUnits",
  "refX",
  "refY",
  "textLength",
  "lengthAdjust",
  "clipPathUnits",
]);

const renamedAttributes: Record<string, string> = {
  className: "class",
  htmlFor: "for",
  xlinkHref: "xlink:href",
  xmlnsXlink: "xmlns:xlink",
  xmlSpace: "xml:space",
};

function attributeName(name: string): string {
  if (renamedAttributes[name]) return renamedAttributes[name];
  if (camelCaseSvgAttributes.has(name) || name.includes("-")) return name;
  return name.replace(/[A-Z]/g, (letter) => `-${letter.toLowerCase()}`);
}

// The same five characters React escapes, so output matches renderToStaticMarkup.
function escapeText(text: string): string {
  return text.replace(/[&<>"']/g, (character) => escapes[character]);
}

const escapes: Record<string, string> = { "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#x27;" };
