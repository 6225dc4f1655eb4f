#!/usr/bin/python3
"""Validates coilfit's JSON inputs and outputs against the shipped JSON Schemas (draft 2020-12).

  validate.py SCHEMAS check                       every schema is a valid 2020-12 schema
  validate.py SCHEMAS file SCHEMA FILE...         JSON files against SCHEMA (a file name in SCHEMAS)
  validate.py SCHEMAS run SCHEMA RCS -- CMD...    runs CMD, expects an exit code in RCS (e.g. 0,1),
                                                  validates its standard output
  validate.py SCHEMAS reject SCHEMA RCS -- CMD...  as run, then copies of the output broken in ways
                                                  the contract forbids (architecture "JSON
                                                  contracts") must each fail

Needs python3-jsonschema (Debian package); without it, exits 77 (ctest: skipped).
"""
import copy
import json
import os
import subprocess
import sys

SKIP = 77

try:
    import jsonschema
    from jsonschema import Draft202012Validator
except ImportError:
    print("SKIP: python3 jsonschema is missing (apt-get install -y python3-jsonschema)")
    sys.exit(SKIP)
try:
    # jsonschema 4.18 and later resolve references through the referencing library ...
    import referencing
    import referencing.jsonschema
except ImportError:
    # ... Debian bookworm's 4.10 through RefResolver.
    referencing = None


def load_store(folder):
    store = {}
    for name in sorted(os.listdir(folder)):
        if name.endswith(".schema.json"):
            with open(os.path.join(folder, name), encoding="utf-8") as f:
                schema = json.load(f)
            store[name] = schema
    if not store:
        sys.exit(f"no *.schema.json in {folder}")
    return store


def validator(store, name):
    schema = store[name]
    if referencing:
        registry = referencing.Registry().with_resources(
            (s["$id"], referencing.jsonschema.DRAFT202012.create_resource(s)) for s in store.values())
        return Draft202012Validator(schema, registry=registry)
    by_id = {s["$id"]: s for s in store.values()}
    return Draft202012Validator(schema, resolver=jsonschema.RefResolver(schema["$id"], schema, store=by_id))


def resolves(store, name, ref):
    """None when ref (as written in schema `name`) resolves, else the reason."""
    v = validator(store, name)
    try:
        if referencing:
            v._resolver.lookup(ref)
        else:
            v.resolver.resolve(ref)
    except Exception as e:  # the two libraries raise different errors
        return (str(e) or type(e).__name__)[:200]
    return None


def errors_of(v, doc):
    return sorted(v.iter_errors(doc), key=lambda e: list(e.absolute_path))


def report(label, errs):
    for e in errs[:10]:
        path = "/".join(str(p) for p in e.absolute_path) or "(top)"
        print(f"{label}: {path}: {e.message[:300]}")
    return 1 if errs else 0


def cmd_check(store):
    bad = 0
    for name, schema in store.items():
        try:
            Draft202012Validator.check_schema(schema)
        except jsonschema.exceptions.SchemaError as e:
            print(f"{name}: not a valid draft 2020-12 schema: {e.message}")
            bad += 1
            continue
        if schema.get("$schema") != "https://json-schema.org/draft/2020-12/schema":
            print(f"{name}: $schema is not draft 2020-12")
            bad += 1
        if not schema.get("$id", "").endswith("/" + name):
            print(f"{name}: $id {schema.get('$id')} does not end in the file's name")
            bad += 1
        # Every $ref must resolve (a typo in a pointer is otherwise found only by the document
        # that reaches it).
        for ref in refs(schema):
            why = resolves(store, name, ref)
            if why:
                print(f"{name}: $ref {ref} does not resolve: {why}")
                bad += 1
    print(f"{len(store)} schemas checked, {bad} problems")
    return 1 if bad else 0


def refs(node):
    if isinstance(node, dict):
        for k, v in node.items():
            if k == "$ref":
                yield v
            else:
                yield from refs(v)
    elif isinstance(node, list):
        for v in node:
            yield from refs(v)


def cmd_file(store, name, files):
    v = validator(store, name)
    bad = 0
    for path in files:
        with open(path, encoding="utf-8") as f:
            doc = json.load(f)
        bad += report(path, errors_of(v, doc))
    print(f"{len(files)} documents against {name}: {bad} invalid")
    return 1 if bad else 0


def run_json(rcs, cmd):
    """The JSON a command prints, or None (with the reason printed)."""
    allowed = {int(x) for x in rcs.split(",")}
    p = subprocess.run(cmd, capture_output=True, text=True)
    if p.returncode not in allowed:
        print(f"exit code {p.returncode}, expected one of {sorted(allowed)}; stderr: {p.stderr.strip()[:400]}")
        return None
    try:
        return json.loads(p.stdout)
    except json.JSONDecodeError as e:
        print(f"standard output is not JSON: {e}")
        return None


def cmd_run(store, name, rcs, cmd):
    doc = run_json(rcs, cmd)
    if doc is None:
        return 1
    bad = report(" ".join(os.path.basename(c) for c in cmd[:3]), errors_of(validator(store, name), doc))
    print(f"{name}: {'invalid' if bad else 'valid'}")
    return bad


def mutations(doc):
    """Copies of a valid output, each broken in one way the contract forbids."""
    def m(label, fn):
        d = copy.deepcopy(doc)
        fn(d)
        return label, d
    out = [m("schema key missing", lambda d: d.pop("schema")),
           m("tool missing", lambda d: d.pop("tool")),
           m("schema of another kind", lambda d: d.__setitem__("schema", "coilfit.other/1"))]
    if isinstance(doc.get("checks"), list) and doc["checks"]:
        first = doc["checks"][0]
        if "verdict" in first:
            out.append(m("verdict outside pass|warn|fail|skip", lambda d: d["checks"][0].__setitem__("verdict", "ok")))
        out.append(m("check id not of the form area.name", lambda d: d["checks"][0].__setitem__("id", "Coil Operate")))
    if isinstance(doc.get("quantities"), dict) and doc["quantities"]:
        key = next(iter(doc["quantities"]))
        # A NaN written by a JSON library comes out as null: the contract forbids both.
        out.append(m("quantity not a number", lambda d: d["quantities"].__setitem__(key, None)))
        out.append(m("quantity as a text", lambda d: d["quantities"].__setitem__(key, "12 V")))
    if isinstance(doc.get("candidates"), list) and doc["candidates"]:
        out.append(m("candidate margin not a number", lambda d: d["candidates"][0].__setitem__("worst_margin", None)))
    if "pass_rate" in doc:
        out.append(m("pass rate above 1", lambda d: d.__setitem__("pass_rate", 1.5)))
    return out


def cmd_reject(store, name, rcs, cmd):
    doc = run_json(rcs, cmd)
    if doc is None:
        return 1
    v = validator(store, name)
    if errors_of(v, doc):
        return report("the output as written (should be valid)", errors_of(v, doc))
    bad = 0
    cases = mutations(doc)
    for label, d in cases:
        if not errors_of(v, d):
            print(f"{name} accepts an output with {label}")
            bad += 1
    print(f"{len(cases)} broken copies of the output: {len(cases) - bad} rejected")
    return 1 if bad or not cases else 0


def main(argv):
    if len(argv) < 3:
        print(__doc__)
        return 2
    store = load_store(argv[1])
    what = argv[2]
    if what == "check":
        return cmd_check(store)
    if what == "file" and len(argv) >= 5:
        return cmd_file(store, argv[3], argv[4:])
    if what == "run" and len(argv) >= 7 and argv[5] == "--":
        return cmd_run(store, argv[3], argv[4], argv[6:])
    if what == "reject" and len(argv) >= 7 and argv[5] == "--":
        return cmd_reject(store, argv[3], argv[4], argv[6:])
    print(__doc__)
    return 2


if __name__ == "__main__":
    sys.exit(main(sys.argv))
