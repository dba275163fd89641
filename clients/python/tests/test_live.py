"""The client against a running Gyrolux server.

tests/e2e/python-client.e2e.ts runs this inside `npm test` with GYROLUX_TEST_BASE_URL,
GYROLUX_TEST_TOKEN (an editor's API token in the demo lab), GYROLUX_TEST_LAB_ID and
GYROLUX_TEST_SET_ID (the demo garnet set). Without them every test here is skipped, and that
integration test fails on a skip.
"""

import math
import os
import time
import unittest
from pathlib import Path

from gyrolux import Client, GyroluxError

BASE = os.environ.get("GYROLUX_TEST_BASE_URL")
TOKEN = os.environ.get("GYROLUX_TEST_TOKEN")
LAB = os.environ.get("GYROLUX_TEST_LAB_ID")
SET = os.environ.get("GYROLUX_TEST_SET_ID")
DEMO_FILE = Path(__file__).resolve().parents[3] / "db" / "demo" / "generated-garnet-LM-T4-verdet.csv"

try:
    import numpy  # noqa: F401

    HAS_NUMPY = True
except ImportError:
    HAS_NUMPY = False


def unique(prefix: str) -> str:
    return f"{prefix} {time.time_ns()}"


@unittest.skipUnless(BASE and TOKEN and LAB and SET, "needs a running server (GYROLUX_TEST_BASE_URL, GYROLUX_TEST_TOKEN, …)")
class LiveTest(unittest.TestCase):
    gx: Client

    @classmethod
    def setUpClass(cls):
        cls.gx = Client(BASE, TOKEN)

    def test_labs_sets_and_versions(self):
        self.assertIn(LAB, [lab["id"] for lab in self.gx.labs()])
        sets = self.gx.parameter_sets(lab_id=LAB)
        self.assertIn(SET, [s["id"] for s in sets])
        garnet = self.gx.parameter_set(SET)
        self.assertGreater(garnet["params"]["ionDensityPerM3"], 0)
        versions = self.gx.versions(SET)
        self.assertEqual(versions[0]["version"], garnet["version"])

    def test_a_refused_request_carries_code_and_fields(self):
        with self.assertRaises(GyroluxError) as caught:
            self.gx.request("POST", "/api/parameter-sets", json_body={"labId": LAB, "name": "", "params": {}})
        self.assertEqual((caught.exception.status, caught.exception.code), (400, "validation"))
        self.assertIn("name", caught.exception.fields)

    def test_upload_fit_and_save_round_trip(self):
        item = self.gx.upload_measurements(LAB, unique("Python upload"), DEMO_FILE, sample="LM-T4 from Python")
        self.assertEqual(item["rowCount"], 24)
        points = self.gx.points(item["id"])
        self.assertEqual(len(points), 24)
        self.assertEqual(points[0]["wavelengthNm"], 420)
        if HAS_NUMPY:
            columns = self.gx.points(item["id"], arrays=True)
            self.assertEqual(columns["value"].shape, (24,))

        # A set of this test's own, so the demo garnet keeps its versions.
        garnet = self.gx.parameter_set(SET)
        own = self.gx.request(
            "POST", "/api/parameter-sets", json_body={"labId": LAB, "name": unique("Python fit"), "params": garnet["params"]}
        )["item"]
        fit = self.gx.fit(own["params"], points, free=["gyrationPerT", "magneticScale"])
        self.assertEqual(fit["free"], ["gyrationPerT", "magneticScale"])
        self.assertTrue(math.isfinite(fit["chi2"]))
        self.assertEqual(fit["dof"], 24 - 2)
        self.assertTrue(fit["engineVersion"])
        # The demo file was generated with magneticScale = 2 (its header says so); the fit finds it within a few σ.
        self.assertLess(abs(fit["values"]["magneticScale"] - 2) / fit["sigmas"]["magneticScale"], 5)
        # The report: the refits with magneticScale held at 0 and at 1, and its profile interval around the fitted value.
        self.assertEqual([c["hypothesis"] for c in fit["comparison"]], ["noMagneticPart", "firstPrinciples"])
        self.assertGreater(fit["comparison"][0]["deltaChi2"], 0)
        profile = fit["profile"]["magneticScale"]
        self.assertLess(profile["interval68"][0], fit["values"]["magneticScale"])
        self.assertGreater(profile["interval68"][1], fit["values"]["magneticScale"])
        self.assertLessEqual(profile["interval95"][0], profile["interval68"][0])
        self.assertEqual(fit["warnings"], [*fit["verdict"]["reasons"], *fit["notes"]])

        saved = self.gx.save_fit(own["id"], fit, [item])
        self.assertEqual(saved["version"], own["version"] + 1)
        provenance = self.gx.versions(own["id"])[0]["provenance"]
        self.assertEqual(provenance["kind"], "fit")
        self.assertEqual(provenance["measurementSets"][0]["id"], item["id"])
        self.assertEqual(provenance["values"]["magneticScale"], fit["values"]["magneticScale"])
        self.assertEqual(provenance["comparison"][0]["deltaChi2"], fit["comparison"][0]["deltaChi2"])
        self.assertEqual(provenance["profile"]["magneticScale"]["interval68"], profile["interval68"])
        self.assertEqual(provenance["verdict"], fit["verdict"])
        self.assertEqual(provenance["sets"], [{"name": "data", "pointCount": 24, "chi2": provenance["sets"][0]["chi2"],
                                               "scaleSigma": 0, "relativeFloor": 0, "temperatureSigmaK": 0}])
        self.assertAlmostEqual(provenance["sets"][0]["chi2"], fit["chi2"], delta=1e-9 * fit["chi2"])
        self.assertEqual((provenance["starts"], provenance["tookModelSign"]), (4, False))
        self.assertTrue(any(a["key"] == "oscillatorWavelengthNm" for a in provenance["assumptions"]))

        # The command line, the fallback above the server's limit, fits the same points to the same optimum.
        local = self.gx.fit(own["params"], points, free=["gyrationPerT", "magneticScale"], local=True)
        self.assertAlmostEqual(local["chi2"], fit["chi2"], delta=1e-6 * fit["chi2"])
        self.assertEqual(local["points"][0]["set"], "data")

    def test_global_fit_of_the_demo_garnet_spectra_saved_with_its_conditions(self):
        """The demo lab's 293 K and 77 K garnet spectra in one fit: a calibration σ on the cold set's field × length,
        a prior on the oscillator wavelength (fitted as a nuisance, not saved as a value)."""
        listed = self.gx.measurement_sets(lab_id=LAB, q="LM-T4")
        warm = next(m for m in listed if "293 K" in m["name"])
        cold = next(m for m in listed if "77 K" in m["name"])
        garnet = self.gx.parameter_set(SET)
        own = self.gx.request(
            "POST", "/api/parameter-sets", json_body={"labId": LAB, "name": unique("Python global fit"), "params": garnet["params"]}
        )["item"]
        sets = [
            {"id": warm["id"], "name": warm["name"], "points": self.gx.points(warm["id"])},
            {"id": cold["id"], "name": cold["name"], "points": self.gx.points(cold["id"]), "calibration": {"scaleSigma": 0.02}},
        ]
        prior_mean = own["params"]["oscillatorWavelengthNm"]
        fit = self.gx.fit(own["params"], sets=sets, free=["gyrationPerT", {"key": "magneticScale", "min": 0}],
                          priors={"oscillatorWavelengthNm": (prior_mean, 10)})
        scale = f"fieldLengthScale[{cold['name']}]"
        self.assertEqual(list(fit["values"]), ["gyrationPerT", "magneticScale", "oscillatorWavelengthNm", scale])
        self.assertEqual(len(fit["correlation"]), 4)
        self.assertEqual({p["set"] for p in fit["points"]}, {warm["name"], cold["name"]})
        self.assertTrue(fit["comparison"])
        self.assertIn("magneticScale", fit["profile"])
        # Each set's χ², with the priors' terms, adds up to the server's χ².
        summaries = fit["sets"]
        penalty = ((fit["values"]["oscillatorWavelengthNm"] - prior_mean) / 10) ** 2 + ((fit["values"][scale] - 1) / 0.02) ** 2
        self.assertAlmostEqual(sum(s["chi2"] for s in summaries) + penalty, fit["chi2"], delta=1e-9 * fit["chi2"])

        self.gx.save_fit(own["id"], fit)
        version = self.gx.versions(own["id"])[0]
        provenance = version["provenance"]
        self.assertEqual(set(provenance["values"]), {"gyrationPerT", "magneticScale"})
        self.assertEqual(version["params"]["magneticScale"], fit["values"]["magneticScale"])
        self.assertEqual([m["id"] for m in provenance["measurementSets"]], [warm["id"], cold["id"]])
        self.assertEqual(provenance["free"], [{"key": "gyrationPerT"}, {"key": "magneticScale", "min": 0}])
        self.assertEqual(provenance["priors"], [{"key": "oscillatorWavelengthNm", "mean": prior_mean, "sigma": 10}])
        self.assertEqual([n["name"] for n in provenance["nuisances"]], ["oscillatorWavelengthNm", scale])
        self.assertEqual([(s["name"], s["scaleSigma"]) for s in provenance["sets"]], [(warm["name"], 0), (cold["name"], 0.02)])
        self.assertEqual(len(provenance["correlation"]), 2)
        # A row whose p-value underflowed (its significance is null in JSON) is not stored; the others are.
        self.assertEqual(provenance.get("comparison", []), [c for c in fit["comparison"] if c["significanceSigma"] is not None])
        self.assertEqual(provenance["verdict"], fit["verdict"])
        self.assertEqual(provenance["pointCount"], len(sets[0]["points"]) + len(sets[1]["points"]))

    def test_a_fit_above_the_servers_limit_names_the_command_line(self):
        params = self.gx.parameter_set(SET)["params"]
        points = [{"wavelengthNm": 400 + i, "value": -300.0, "sigma": 5.0} for i in range(501)]
        with self.assertRaises(GyroluxError) as caught:
            self.gx.fit(params, points, free=["gyrationPerT"])
        self.assertEqual((caught.exception.status, caught.exception.code), (413, "payload_too_large"))
        self.assertIn("local=True", caught.exception.message)

    def test_lab_run_submit_wait_result(self):
        params = self.gx.parameter_set(SET)["params"]
        payload = {"params": params, "method": "analytic", "wavelengths": {"fromNm": 400, "toNm": 1600, "count": 16, "spacing": "log"}}
        result = self.gx.run_and_wait(LAB, "spectrum", payload, timeout=180, parameter_set_id=SET)
        columns = result["columns"]
        self.assertTrue(columns)
        first = next(iter(columns.values()))
        self.assertEqual(len(first), 16)
        self.assertIsInstance(first, list)
        if HAS_NUMPY:
            arrays = self.gx.result(result["runId"], arrays=True)["columns"]
            self.assertEqual(next(iter(arrays.values())).shape, (16,))


if __name__ == "__main__":
    unittest.main()
