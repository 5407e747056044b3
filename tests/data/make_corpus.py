#!/usr/bin/env python3
"""Writes the bad-file corpus under tests/data/ (team, locker and settings files).

Each file is something a person, an editor, a crash or another program could leave
behind. tests/bad_files.rs says what each one must give. Files over the 1 MB limit are
made by the test itself rather than kept here. Run from tests/data/: python3 make_corpus.py
"""
import json

demo = open("../../examples/hollowmere-team.json", "rb").read()


def w(path, data):
    open(path, "wb").write(data if isinstance(data, bytes) else data.encode())


def nest(n):
    return b"[" * n + b"]" * n


# ---- team files (read by `turnsheet plan` and `chart`; the user owns them) ----
t = "team/"
w(t + "empty.json", b"")
w(t + "whitespace-only.json", b"  \n\t\n")
w(t + "binary-garbage.json", bytes(range(256)))
w(t + "truncated.json", demo[: len(demo) // 2])
i = demo.index(b"Ines")
w(t + "latin1-name.json", demo[:i] + b"In\xe8s" + demo[i + 4 :])
w(t + "top-level-array.json", b"[1, 2, 3]\n")
w(t + "unknown-key.json", demo.replace(b'"units"', b'"colour": "red", "units"', 1))
w(t + "duplicate-key.json", demo.replace(b'"units"', b'"rule": "halves", "units"', 1))
w(t + "deep-nesting.json", b'{"units": "metric", "divers": ' + nest(5000) + b"}")
w(t + "nan-literal.json", demo.replace(b'"start": 218', b'"start": NaN', 1))
w(t + "huge-start.json", demo.replace(b'"start": 218', b'"start": 1e308', 1))
w(t + "number-overflow.json", demo.replace(b'"start": 218', b'"start": 1e999', 1))
w(t + "count-overflow.json", demo.replace(b'"count": 2', b'"count": 4294967296', 1))
w(t + "long-name.json", demo.replace(b'"Ines"', b'"' + b"I" * 5000 + b'"', 1))
w(t + "many-divers.json",
  json.dumps({"units": "metric", "divers": [json.loads(demo)["divers"][0]] * 50}).encode())
w(t + "lone-surrogate.json", demo.replace(b'"Ines"', b'"\\ud800"', 1))

# ---- locker files (locker.json in the data directory; the app owns it) ----
set12 = {"id": 1, "name": "Twin 12s",
         "cylinders": {"count": 2, "water_l": 12, "working_bar": 232}}
l = "locker/"
w(l + "empty.json", b"")
w(l + "binary-garbage.json", bytes(range(256)))
good = json.dumps({"schema": 1, "entries": [set12]}, indent=2).encode()
w(l + "truncated.json", good[: len(good) // 2])
w(l + "latin1-name.json", good.replace(b"Twin 12s", b"Twin 12\xe8"))
w(l + "future-schema.json", json.dumps({"schema": 2, "entries": [set12], "owner": "x"}))
w(l + "no-schema.json", json.dumps({"entries": [set12]}))
w(l + "entries-is-object.json", json.dumps({"schema": 1, "entries": {"a": set12}}))
w(l + "unknown-key.json", json.dumps({"schema": 1, "entries": [dict(set12, colour="red")]}))
w(l + "long-name.json", json.dumps({"schema": 1, "entries": [dict(set12, name="N" * 300)]}))
w(l + "long-note.json", json.dumps({"schema": 1, "entries": [dict(set12, note="n" * 61)]}))
w(l + "empty-name.json", json.dumps({"schema": 1, "entries": [dict(set12, name="  ")]}))
w(l + "too-many-sets.json", json.dumps(
    {"schema": 1, "entries": [dict(set12, id=k + 1, name=f"S{k}") for k in range(501)]}))
w(l + "deep-nesting.json", b'{"schema": 1, "entries": ' + nest(5000) + b"}")
w(l + "negative-id.json", json.dumps({"schema": 1, "entries": [dict(set12, id=-1)]}))
w(l + "nul-bytes.json", b"\x00" * 64)

# ---- settings files (settings.json in the data directory; the app owns it) ----
s = "settings/"
settings = {"schema": 1, "units": "metric", "gauge_step_bar": 10.0, "gauge_step_psi": 100.0,
            "rule": "thirds", "water_temp_c": 20.0, "cautions_acknowledged": True}
text = json.dumps(settings, indent=2).encode()
w(s + "empty.json", b"")
w(s + "binary-garbage.json", bytes(range(256)))
w(s + "truncated.json", text[: len(text) // 2])
w(s + "latin1.json", text.replace(b'"metric"', b'"m\xe9tric"'))
w(s + "future-schema.json", json.dumps(dict(settings, schema=5, theme="dark")))
w(s + "unknown-units.json", json.dumps(dict(settings, units="furlongs")))
w(s + "unknown-key.json", json.dumps(dict(settings, colour="red")))
w(s + "wrong-type.json", json.dumps(dict(settings, water_temp_c="warm")))
w(s + "deep-nesting.json", b'{"schema": 1, "units": ' + nest(5000) + b"}")
w(s + "top-level-array.json", b"[]")
# One bad field among good ones that are not the defaults: the app resets that field
# and keeps the others.
kept = dict(settings, units="imperial", gauge_step_psi=50.0, rule="quarters", water_temp_c=12.0)
w(s + "hot-water.json", json.dumps(dict(kept, water_temp_c=300.0)))
w(s + "zero-step.json", json.dumps(dict(kept, gauge_step_bar=0)))
w(s + "unknown-rule.json", json.dumps(dict(kept, rule="tenths")))
