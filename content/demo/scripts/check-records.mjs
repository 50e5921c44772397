// Checks the demo decision records and lessons in content/demo/records against the record format,
// against team.json and against each other, and checks the attachments they point to.
// Usage: node content/demo/scripts/check-records.mjs   (exit code 1 when any error is found)
import { readFileSync, readdirSync, statSync, existsSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";

const DEMO = join(dirname(fileURLToPath(import.meta.url)), "..");
const RECORDS = join(DEMO, "records");
const ATTACHMENTS = join(DEMO, "attachments");
const team = JSON.parse(readFileSync(join(DEMO, "team.json"), "utf8"));

// Both YAML parsers are transitive dependencies, not declared ones, so load whichever is there
// and demand that every one present accepts the front matter: a file that only one parser
// accepts would break whichever importer happens to use the other.
const parsers = [];
try {
  const YAML = await import("yaml");
  parsers.push({ name: "yaml", parse: (s) => YAML.parse(s, { strict: true, uniqueKeys: true, prettyErrors: true }) });
} catch { /* not installed */ }
try {
  const jsyaml = (await import("js-yaml")).default;
  parsers.push({ name: "js-yaml", parse: (s) => jsyaml.load(s) });
} catch { /* not installed */ }
if (parsers.length === 0) {
  console.error("No YAML parser found (run npm install first): cannot check front matter.");
  process.exit(2);
}

const SUBSYSTEMS = new Set(team.subsystems.map((s) => s.slug));
const SEASONS = new Map(team.seasons.map((s) => [s.name, s]));
const SEASON_ORDER = team.seasons.map((s) => s.name);
const PEOPLE = new Map(team.people.map((p) => [p.email, p]));
const LAST_DAY = team.seasons.map((s) => s.endsOn).sort().at(-1);
const STATUS = {
  decision: new Set(["draft", "proposed", "accepted", "superseded", "withdrawn"]),
  lesson: new Set(["open", "addressed"]),
};
const SECTIONS = {
  decision: ["Context", "Options considered", "Decision", "Consequences"],
  lesson: ["What happened", "Impact", "Root cause", "Recommendation for the next cohort"],
};
const SOURCES = new Set(["testing", "building", "racing", "organising"]);
// Saved demo calculations and the season each belongs to; a record may link only its own or earlier seasons.
const CALCS = {
  "demo-calc-prop-endurance-2526": "2025–26", "demo-calc-prop-sprint-2526": "2025–26",
  "demo-calc-resistance-2526": "2025–26", "demo-calc-energy-endurance-2526": "2025–26",
  "demo-calc-solar-deck-2526": "2025–26", "demo-calc-cooling-controller-2526": "2025–26",
  "demo-calc-cable-battery-main-2526": "2025–26", "demo-calc-race-endurance-2526": "2025–26",
  "demo-calc-sweep-2526": "2025–26", "demo-calc-prop-endurance-2425": "2024–25",
  "demo-calc-resistance-2425": "2024–25", "demo-calc-cooling-2425": "2024–25",
  "demo-calc-water-2425": "2024–25", "demo-calc-cable-steering-2324": "2023–24",
  "demo-calc-energy-2324": "2023–24", "demo-calc-solar-2324": "2023–24",
};
const ALLOWED_KEYS = new Set(["id", "kind", "title", "subsystem", "season", "status", "author", "createdAt", "source",
  "calculations", "related", "supersedes", "reviewedBy", "reviewedOn", "attachments", "comments", "firstStatus", "versions"]);
const REVIEWERS = new Set(["advisor@wakebook.test", "ruth.calloway@wakebook.test"]);

const errors = [];
const notes = [];
const err = (file, msg) => errors.push(`${file}: ${msg}`);

// js-yaml turns unquoted dates into Date objects, yaml 2 keeps them as strings.
function isoDate(v) {
  if (v instanceof Date && !Number.isNaN(v.getTime())) return v.toISOString().slice(0, 10);
  if (typeof v === "string" && /^\d{4}-\d{2}-\d{2}$/.test(v) && !Number.isNaN(Date.parse(v))) return v;
  return null;
}
function isoDateTime(v) {
  if (v instanceof Date && !Number.isNaN(v.getTime())) return v.toISOString();
  if (typeof v === "string" && /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2})?Z$/.test(v) && !Number.isNaN(Date.parse(v)))
    return new Date(v).toISOString();
  return null;
}
const isStringList = (v) => Array.isArray(v) && v.every((x) => typeof x === "string");
function stripForComparison(v) {
  return JSON.parse(JSON.stringify(v, (_k, x) => (x instanceof Date ? x.toISOString() : x)));
}
function sameData(a, b) {
  const norm = (x) => JSON.stringify(stripForComparison(x), (_k, v) =>
    typeof v === "string" && /^\d{4}-\d{2}-\d{2}(T[\d:.]+Z)?$/.test(v) ? new Date(v).toISOString() : v);
  return norm(a) === norm(b);
}
function workedIn(email, season) {
  return PEOPLE.get(email)?.seasons.find((s) => s.season === season);
}

// ---------- read and parse ----------
const records = [];
for (const file of readdirSync(RECORDS).filter((f) => f.endsWith(".md")).sort()) {
  const text = readFileSync(join(RECORDS, file), "utf8");
  const m = text.match(/^---\n([\s\S]*?)\n---\n([\s\S]*)$/);
  if (!m) { err(file, "no front matter block delimited by --- lines"); continue; }
  const [, fm, body] = m;
  let data;
  const parsed = [];
  for (const p of parsers) {
    try { parsed.push(p.parse(fm)); } catch (e) { err(file, `${p.name} cannot parse front matter: ${String(e.message).split("\n")[0]}`); }
  }
  if (parsed.length !== parsers.length) continue;
  data = parsed[0];
  if (parsed.length === 2 && !sameData(parsed[0], parsed[1])) err(file, "the YAML parsers disagree on the front matter");
  if (!data || typeof data !== "object" || Array.isArray(data)) { err(file, "front matter is not a mapping"); continue; }
  records.push({ file, data, body });
}

// ---------- per-record checks ----------
const byId = new Map();
for (const { file, data: r } of records) {
  if (typeof r.id !== "string" || !/^demo-rec-[a-z0-9]+(-[a-z0-9]+)*$/.test(r.id)) err(file, `bad id ${r.id}`);
  else if (byId.has(r.id)) err(file, `duplicate id ${r.id} (also in ${byId.get(r.id).file})`);
  else byId.set(r.id, { file, r });
  if (r.id && file !== `${r.id}.md`) err(file, `file name does not match id ${r.id}`);
}

const calcLinked = [];
for (const { file, data: r, body } of records) {
  for (const k of Object.keys(r)) if (!ALLOWED_KEYS.has(k)) err(file, `unknown front matter key ${k}`);
  if (!(r.kind in STATUS)) { err(file, `bad kind ${r.kind}`); continue; }
  if (typeof r.title !== "string" || r.title.trim().length < 10) err(file, "title missing or too short");
  if (!SUBSYSTEMS.has(r.subsystem)) err(file, `unknown subsystem ${r.subsystem}`);
  const season = SEASONS.get(r.season);
  if (!season) err(file, `unknown season ${JSON.stringify(r.season)}`);
  if (!STATUS[r.kind].has(r.status)) err(file, `status ${r.status} not valid for a ${r.kind}`);

  const created = isoDate(r.createdAt);
  if (!created) err(file, `createdAt is not a date: ${r.createdAt}`);
  else if (season && (created < season.startsOn || created > season.endsOn)) err(file, `createdAt ${created} outside ${r.season}`);

  const person = PEOPLE.get(r.author);
  const stint = workedIn(r.author, r.season);
  if (!person) err(file, `author ${r.author} not in team.json`);
  else if (!stint) err(file, `author ${r.author} did not work in ${r.season}`);
  else if (!stint.subsystems.includes(r.subsystem))
    notes.push(`${r.id}: author ${r.author} worked in ${r.season} but not on ${r.subsystem} (${stint.role}, ${stint.subsystems.join("/") || "-"})`);

  if (r.kind === "lesson") {
    if (!SOURCES.has(r.source)) err(file, `lesson source ${r.source} not one of ${[...SOURCES].join(", ")}`);
  } else if (r.source !== undefined) err(file, "source is only for lessons");

  if (r.calculations !== undefined) {
    if (!isStringList(r.calculations) || r.calculations.length === 0) err(file, "calculations must be a non-empty list of ids");
    else {
      calcLinked.push(r.id);
      for (const c of r.calculations) {
        if (!(c in CALCS)) err(file, `unknown calculation ${c}`);
        else if (SEASON_ORDER.indexOf(CALCS[c]) > SEASON_ORDER.indexOf(r.season)) err(file, `links ${c} from a later season`);
      }
      if (new Set(r.calculations).size !== r.calculations.length) err(file, "duplicate calculation link");
    }
  }
  if (r.related !== undefined) {
    if (!isStringList(r.related) || r.related.length === 0) err(file, "related must be a non-empty list of ids");
    else for (const t of r.related) {
      if (t === r.id) err(file, "related links to itself");
      else if (!byId.has(t)) err(file, `related target ${t} does not exist`);
    }
  }
  if (r.supersedes !== undefined) {
    const t = byId.get(r.supersedes)?.r;
    if (r.kind !== "decision") err(file, "only decisions can supersede");
    if (!t) err(file, `supersedes target ${r.supersedes} does not exist`);
    else {
      if (t.kind !== "decision") err(file, `supersedes ${t.id}, which is not a decision`);
      if (t.status !== "superseded") err(file, `supersedes ${t.id}, whose status is ${t.status}, not superseded`);
      if (t.subsystem !== r.subsystem) err(file, `supersedes ${t.id} of another subsystem`);
      if (SEASON_ORDER.indexOf(t.season) >= SEASON_ORDER.indexOf(r.season)) err(file, `supersedes ${t.id}, which is not from an earlier season`);
    }
  }
  if ((r.reviewedBy === undefined) !== (r.reviewedOn === undefined)) err(file, "reviewedBy and reviewedOn go together");
  if (r.reviewedBy !== undefined) {
    const rs = workedIn(r.reviewedBy, r.season);
    if (!REVIEWERS.has(r.reviewedBy)) err(file, `reviewer ${r.reviewedBy} is not an advisor`);
    else if (!rs || rs.role !== "advisor") err(file, `reviewer ${r.reviewedBy} was not an advisor in ${r.season}`);
    const on = isoDate(r.reviewedOn);
    if (!on) err(file, `reviewedOn is not a date: ${r.reviewedOn}`);
    else if (created && (on < created || on > LAST_DAY)) err(file, `reviewedOn ${on} before createdAt or after the last season`);
  }
  if (r.attachments !== undefined) {
    if (!isStringList(r.attachments) || r.attachments.length === 0) err(file, "attachments must be a non-empty list of file names");
    else for (const a of r.attachments) {
      if (a.includes("/") || !existsSync(join(ATTACHMENTS, a))) err(file, `attachment ${a} not found in attachments/`);
    }
  }
  if (r.comments !== undefined) {
    if (!Array.isArray(r.comments) || r.comments.length === 0) err(file, "comments must be a non-empty list");
    else {
      let prev = "";
      const keys = new Map();
      r.comments.forEach((c, i) => {
        const where = `comment ${i + 1}`;
        if (!c || typeof c !== "object") { err(file, `${where} is not a mapping`); return; }
        for (const k of Object.keys(c))
          if (!["author", "at", "body", "key", "kind", "replyTo", "answeredBy", "answeredOn"].includes(k)) err(file, `${where}: unknown key ${k}`);
        if (c.kind !== undefined && !["question", "note"].includes(c.kind)) err(file, `${where}: kind is question or note`);
        if (c.key !== undefined) keys.set(c.key, c);
        if (c.replyTo !== undefined && !keys.has(c.replyTo)) err(file, `${where}: replies to ${c.replyTo}, which comes nowhere before it`);
        if (c.replyTo !== undefined && c.kind === "question") err(file, `${where}: a reply cannot be a question`);
        if ((c.answeredBy === undefined) !== (c.answeredOn === undefined)) err(file, `${where}: answeredBy and answeredOn go together`);
        if (c.answeredBy !== undefined && c.kind !== "question") err(file, `${where}: only a question is answered`);
        if (c.answeredBy !== undefined && !PEOPLE.has(c.answeredBy)) err(file, `${where}: answeredBy ${c.answeredBy} not in team.json`);
        if (c.answeredOn !== undefined && isoDateTime(c.answeredOn) < isoDateTime(c.at)) err(file, `${where}: answered before it was asked`);
        if (!PEOPLE.has(c.author)) err(file, `${where}: author ${c.author} not in team.json`);
        const at = isoDateTime(c.at);
        if (!at) err(file, `${where}: at is not an ISO date-time: ${c.at}`);
        else {
          if (created && at.slice(0, 10) < created) err(file, `${where}: written before the record (${at})`);
          if (at.slice(0, 10) > LAST_DAY) err(file, `${where}: after the last season (${at})`);
          if (at < prev) err(file, `${where}: out of time order`);
          prev = at;
        }
        if (typeof c.body !== "string" || c.body.trim().length < 20) err(file, `${where}: body missing or too short`);
      });
    }
  }

  // ---------- body ----------
  const headings = [...body.matchAll(/^## (.+)$/gm)].map((h) => h[1].trim());
  if (JSON.stringify(headings) !== JSON.stringify(SECTIONS[r.kind]))
    err(file, `sections are [${headings.join(" | ")}], expected [${SECTIONS[r.kind].join(" | ")}]`);
  if (!body.trimStart().startsWith(`## ${SECTIONS[r.kind][0]}`)) err(file, "body must start with the first section");
  for (const part of body.split(/^## .+$/m).slice(1)) if (part.trim().length === 0) err(file, "an empty section");
  if (/<\/?[a-zA-Z][^>]*>/.test(body)) err(file, "HTML in body");
  if (/^\s*\|.*\|\s*$/m.test(body)) err(file, "table in body");
  if (/!\[[^\]]*\]\(/.test(body)) err(file, "image in body");
  if (/^#(?!##? )|^#{4,} /m.test(body)) err(file, "only ## sections and ### sub-headings are allowed");
  for (const l of body.matchAll(/\[[^\]]+\]\(([^)]*)\)/g)) if (!/^https:\/\//.test(l[1])) err(file, `link target ${l[1]} is not https`);
  if (/^\s*[*+] /m.test(body)) err(file, "bullets must use -");
  const words = body.replace(/^#+ .*$/gm, "").split(/\s+/).filter((w) => /[\p{L}\p{N}]/u.test(w)).length;
  if (words < 150 || words > 450) err(file, `body has ${words} words, expected 150–450`);
  byId.get(r.id) && (byId.get(r.id).words = words);
}

// ---------- cross-record checks ----------
const supersededBy = new Map();
for (const { data: r } of records) if (typeof r.supersedes === "string") {
  supersededBy.set(r.supersedes, [...(supersededBy.get(r.supersedes) ?? []), r.id]);
}
for (const { file, data: r } of records) {
  if (r.kind === "decision" && r.status === "superseded") {
    const by = supersededBy.get(r.id) ?? [];
    if (by.length !== 1) err(file, `superseded decision is the target of ${by.length} supersedes links (expected exactly 1)`);
  }
}
// Longest lineage: follow supersedes back from every record.
let longestChain = [];
for (const { data: r } of records) {
  const chain = [r.id];
  let cur = r;
  while (typeof cur.supersedes === "string" && byId.has(cur.supersedes) && chain.length < 20) {
    cur = byId.get(cur.supersedes).r;
    chain.unshift(cur.id);
  }
  if (chain.length > longestChain.length) longestChain = chain;
}

// ---------- attachments ----------
const attachmentFiles = existsSync(ATTACHMENTS) ? readdirSync(ATTACHMENTS).sort() : [];
const referenced = new Set(records.flatMap(({ data: r }) => (Array.isArray(r.attachments) ? r.attachments : [])));
for (const a of attachmentFiles) {
  const path = join(ATTACHMENTS, a);
  const size = statSync(path).size;
  if (size >= 100 * 1024) err(`attachments/${a}`, `${size} bytes, must be under 100 kB`);
  if (!referenced.has(a)) err(`attachments/${a}`, "not attached to any record");
  if (a.endsWith(".csv")) {
    const lines = readFileSync(path, "utf8").trimEnd().split("\n");
    const header = lines[0].split(",");
    if (!header.every((h) => /^[a-z][A-Za-z0-9_]*$/.test(h))) err(`attachments/${a}`, `first line is not a header row: ${lines[0]}`);
    if (lines.length < 10) err(`attachments/${a}`, "fewer than 9 data rows");
    lines.slice(1).forEach((l, i) => {
      const cells = l.split(",");
      if (cells.length !== header.length || !cells.every((c) => c !== "" && Number.isFinite(Number(c))))
        err(`attachments/${a}`, `row ${i + 2} is not ${header.length} numbers: ${l}`);
    });
  } else if (a.endsWith(".png")) {
    const buf = readFileSync(path);
    const sig = "89504e470d0a1a0a";
    if (buf.subarray(0, 8).toString("hex") !== sig || buf.subarray(12, 16).toString("ascii") !== "IHDR")
      err(`attachments/${a}`, "not a PNG file");
    else notes.push(`attachments/${a}: PNG ${buf.readUInt32BE(16)}×${buf.readUInt32BE(20)}, ${size} bytes`);
  } else err(`attachments/${a}`, "unexpected attachment type");
}

// ---------- what the demo as a whole must show ----------
const all = records.map((x) => x.data);
const count = (f) => all.filter(f).length;
const need = (ok, msg) => { if (!ok) errors.push(`demo set: ${msg}`); };
need(all.length >= 28, `only ${all.length} records, need at least 28`);
for (const s of SUBSYSTEMS) need(all.some((r) => r.subsystem === s), `no record for subsystem ${s}`);
for (const s of SEASONS.keys()) need(all.some((r) => r.season === s), `no record for season ${s}`);
need(supersededBy.size >= 4, `only ${supersededBy.size} supersede pairs, need 4`);
need(longestChain.length >= 3, "no supersede chain across three seasons");
need(count((r) => r.status === "withdrawn") >= 1, "no withdrawn decision");
need(count((r) => r.season === "2025–26" && r.status === "proposed") >= 2, "fewer than two proposed decisions in 2025–26");
need(count((r) => r.season === "2025–26" && r.status === "draft") >= 1, "no draft decision in 2025–26");
for (const s of SOURCES) need(all.some((r) => r.kind === "lesson" && r.source === s), `no lesson from ${s}`);
need(count((r) => r.status === "open") >= 1 && count((r) => r.status === "addressed") > count((r) => r.status === "open"),
  "lessons should be some open, most addressed");
need(calcLinked.length >= 10, `only ${calcLinked.length} records link calculations, need 10`);
need(count((r) => Array.isArray(r.comments) && new Set(r.comments.map((c) => c.author)).size >= 2) >= 6,
  "fewer than 6 records with a comment thread of two or more people");
need(count((r) => Array.isArray(r.comments) && r.comments.some((c) => PEOPLE.get(c.author)?.role === "alumni")) >= 6,
  "fewer than 6 records where alumni answer");
need(count((r) => r.reviewedBy) >= 3, "fewer than 3 reviewed records");
need(attachmentFiles.filter((a) => a.endsWith(".csv")).length >= 2, "fewer than two CSV attachments");
need(attachmentFiles.filter((a) => a.endsWith(".png")).length >= 2, "fewer than two PNG attachments");

// ---------- report ----------
console.log(`Parsed with: ${parsers.map((p) => p.name).join(", ")}`);
console.log(`\n${"id".padEnd(48)} ${"kind".padEnd(8)} ${"status".padEnd(10)} ${"subsystem".padEnd(10)} season   words`);
for (const r of [...all].sort((a, b) => SEASON_ORDER.indexOf(a.season) - SEASON_ORDER.indexOf(b.season) || String(a.id).localeCompare(String(b.id))))
  console.log(`${String(r.id).padEnd(48)} ${String(r.kind).padEnd(8)} ${String(r.status).padEnd(10)} ${String(r.subsystem).padEnd(10)} ${r.season}  ${byId.get(r.id)?.words ?? "?"}`);
console.log(`\nRecords: ${all.length} (${count((r) => r.kind === "decision")} decisions, ${count((r) => r.kind === "lesson")} lessons)`);
console.log(`Supersede pairs: ${supersededBy.size}; longest lineage: ${longestChain.join(" -> ")}`);
console.log(`Records linking calculations: ${calcLinked.length}; with comments: ${count((r) => Array.isArray(r.comments))}; reviewed: ${count((r) => r.reviewedBy)}`);
console.log(`Attachments: ${attachmentFiles.length} files, ${referenced.size} referenced`);
if (notes.length) console.log(`\nNotes:\n- ${notes.join("\n- ")}`);
if (errors.length) {
  console.log(`\nFAIL: ${errors.length} error(s)\n- ${errors.join("\n- ")}`);
  process.exit(1);
}
console.log("\nOK: no errors");
