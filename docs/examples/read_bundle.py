#!/usr/bin/env python3
"""A small reader of Gramline hand-off bundles for rig controller scripts.

Plain Python 3, standard library only. It

  * opens a bundle (the zip file `gramline-cli export` writes) and checks that manifest.json
    lists exactly the other files, each with its size and SHA-256 (docs/plan-files.md,
    "bundle" in the README);
  * iterates the steps of steps.json in the order the rig runs them, with every motor's
    position in degrees (the plate's frame) or in motor units
    (round((position_deg + zero_offset_deg) x steps_per_deg), docs/plan-files.md,
    "Motor units");
  * writes a counts file, one row per counted step, in the format ingest reads
    (docs/counts-format.md).

Use it as a module from a controller script:

    import read_bundle
    bundle = read_bundle.Bundle("night.zip")          # raises BundleError if anything is off
    for step in bundle.steps():
        move_motors(step.motor_units() or step.position_deg)
        ...

or from the command line:

    python3 read_bundle.py night.zip                  # verify and summarise
    python3 read_bundle.py night.zip --list --units steps
    python3 read_bundle.py night.zip --dry-run-counts counts.csv

`--dry-run-counts` writes, for every measure and reference step, the counts the plan expects
(no randomness, no rig): a way to test a controller's file handling end to end. The file is
marked as simulated, so ingest reports it as such. A real controller replaces
`expected_counts` by what its detectors counted.
"""

import argparse
import hashlib
import json
import math
import sys
import zipfile

MANIFEST = "manifest.json"
COUNTED_KINDS = ("measure", "reference")


class BundleError(Exception):
    """A bundle that cannot be trusted; the message names the bundle and the file."""


def round_half_away(x):
    """Nearest whole number, halves away from zero (as docs/plan-files.md says)."""
    return int(math.copysign(math.floor(abs(x) + 0.5), x))


class Motor:
    def __init__(self, entry):
        self.name = entry["name"]
        self.photon = entry["photon"]
        self.stage = entry["stage"]
        self.plate = entry["plate"]
        self.steps_per_deg = entry.get("steps_per_deg")
        self.zero_offset_deg = entry.get("zero_offset_deg", 0.0)

    def has_motor_units(self):
        return self.steps_per_deg is not None

    def to_motor_units(self, position_deg):
        return round_half_away((position_deg + self.zero_offset_deg) * self.steps_per_deg)

    def from_motor_units(self, steps):
        return steps / self.steps_per_deg - self.zero_offset_deg


class Step:
    def __init__(self, entry, motors):
        self.index = entry["index"]
        self.kind = entry["kind"]
        self.block = entry["block"]
        self.prep_point = entry["prep_point"]
        self.analysis_point = entry["analysis_point"]
        self.position_deg = {m.name: entry["position_deg"][m.name] for m in motors}
        self.kernel_ideal = entry["kernel_ideal"]
        self.p_pass = entry["p_pass"]
        self.pairs = entry["pairs"]
        self.dwell_s = entry["dwell_s"]
        self.move_s = entry["move_s"]
        self.start_s = entry["start_s"]
        self.night = entry["night"]
        self._motors = motors

    def motor_units(self):
        """Motor name -> whole motor units, for the motors that have motor units."""
        return {
            m.name: m.to_motor_units(self.position_deg[m.name])
            for m in self._motors
            if m.has_motor_units()
        }

    def counting_interval_s(self):
        """The plan's counting interval: after the move, for dwell_s seconds."""
        start = self.start_s + self.move_s
        return start, start + self.dwell_s


class Bundle:
    def __init__(self, path):
        self.path = path
        try:
            with zipfile.ZipFile(path) as archive:
                self.entries = {name: archive.read(name) for name in archive.namelist()}
        except (OSError, zipfile.BadZipFile, KeyError) as e:
            raise BundleError("%s: not a readable bundle (%s)" % (path, e))
        self.manifest_sha256 = self._verify()
        steps_file = json.loads(self.entries["steps.json"].decode("utf-8"))
        if steps_file.get("format") != "gramline-steps" or steps_file.get("version", 0) > 1:
            raise BundleError("%s: steps.json: not a steps file this reader knows" % path)
        self.motors = [Motor(m) for m in steps_file["motors"]]
        self._steps = steps_file["steps"]
        campaign = json.loads(self.entries["campaign.json"].decode("utf-8"))
        self.scheme = campaign["rig"]["scheme"]
        self.photons = 1 + max(m.photon for m in self.motors)
        self.manifest = json.loads(self.entries[MANIFEST].decode("utf-8"))

    def _verify(self):
        if MANIFEST not in self.entries:
            raise BundleError("%s: %s: missing" % (self.path, MANIFEST))
        manifest = json.loads(self.entries[MANIFEST].decode("utf-8"))
        listed = {}
        for f in manifest.get("files", []):
            listed[f["name"]] = f
        others = set(self.entries) - {MANIFEST}
        for name in sorted(others - set(listed)):
            raise BundleError("%s: %s: not listed in the manifest" % (self.path, name))
        for name in sorted(set(listed) - others):
            raise BundleError("%s: %s: listed in the manifest but missing" % (self.path, name))
        for name in sorted(others):
            data = self.entries[name]
            if len(data) != listed[name]["bytes"]:
                raise BundleError("%s: %s: %d bytes, the manifest says %d"
                                  % (self.path, name, len(data), listed[name]["bytes"]))
            if hashlib.sha256(data).hexdigest() != listed[name]["sha256"]:
                raise BundleError("%s: %s: SHA-256 differs from the manifest (changed "
                                  "after export)" % (self.path, name))
        return hashlib.sha256(self.entries[MANIFEST]).hexdigest()

    def steps(self):
        """The steps in the order the rig runs them."""
        for entry in self._steps:
            yield Step(entry, self.motors)

    def channels(self):
        return 2 ** self.photons if self.scheme == "both-ports" else 1


def expected_counts(bundle, step):
    """The counts the plan expects for a step (pairs x pass probability in the pass channel;
    the rest shared evenly by the other channels of a both-ports rig). No noise, no
    accidentals: a stand-in for what a rig would count."""
    channels = bundle.channels()
    counts = [round_half_away(step.pairs * step.p_pass)]
    if channels > 1:
        rest = step.pairs * (1.0 - step.p_pass) / (channels - 1)
        counts += [round_half_away(rest)] * (channels - 1)
    return counts


def write_counts(bundle, out, count_step=expected_counts, note=None):
    """Writes a counts file (docs/counts-format.md): the bundle named on the first line, an
    optional simulated mark, the header, then one row per measure and reference step."""
    out.write("# bundle file: %s, manifest SHA-256 %s\n"
              % (bundle.path.replace("\\", "/").split("/")[-1], bundle.manifest_sha256))
    if note:
        out.write("# simulated: %s\n" % note)
    header = ["step", "kind", "start_s", "end_s"]
    header += ["ch%d" % k for k in range(bundle.channels())]
    out.write(",".join(header) + "\n")
    rows = 0
    for step in bundle.steps():
        if step.kind not in COUNTED_KINDS:
            continue
        start, end = step.counting_interval_s()
        fields = [str(step.index), step.kind, repr(start), repr(end)]
        fields += [str(int(n)) for n in count_step(bundle, step)]
        out.write(",".join(fields) + "\n")
        rows += 1
    return rows


def main(argv):
    parser = argparse.ArgumentParser(description="Verify and read a Gramline bundle.")
    parser.add_argument("bundle")
    parser.add_argument("--list", action="store_true", help="print every step's positions")
    parser.add_argument("--units", choices=("deg", "steps"), default="deg",
                        help="positions in degrees or in motor units (motors without "
                             "steps_per_deg stay in degrees)")
    parser.add_argument("--dry-run-counts", metavar="CSV",
                        help="write the plan's expected counts as a counts file")
    args = parser.parse_args(argv)
    try:
        bundle = Bundle(args.bundle)
    except BundleError as e:
        print(e, file=sys.stderr)
        return 2
    steps = list(bundle.steps())
    print("%s: verified %d files (manifest SHA-256 %s); %d steps, %d motors, %s detection"
          % (args.bundle, len(bundle.entries) - 1, bundle.manifest_sha256, len(steps),
             len(bundle.motors), bundle.scheme))
    if args.list:
        for step in steps:
            units = step.motor_units() if args.units == "steps" else {}
            where = ", ".join(
                "%s=%s" % (name, units[name] if name in units else "%.6f deg" % deg)
                for name, deg in step.position_deg.items())
            print("%d %s night %d: %s" % (step.index, step.kind, step.night, where))
    if args.dry_run_counts:
        with open(args.dry_run_counts, "w", encoding="utf-8", newline="\n") as out:
            rows = write_counts(bundle, out,
                                note="expected counts of the plan, written by "
                                     "docs/examples/read_bundle.py; not measured on a rig")
        print("wrote %d rows to %s" % (rows, args.dry_run_counts))
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
