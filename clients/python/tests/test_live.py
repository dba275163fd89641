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
        # The demo file was generated with magneticScale = 2 (its header says so); the fit finds it within a few σ.
        self.assertLess(abs(fit["values"]["magneticScale"] - 2) / fit["sigmas"]["magneticScale"], 5)

        saved = self.gx.save_fit(own["id"], fit, [item])
        self.assertEqual(saved["version"], own["version"] + 1)
        provenance = self.gx.versions(own["id"])[0]["provenance"]
        self.assertEqual(provenance["kind"], "fit")
        self.assertEqual(provenance["measurementSets"][0]["id"], item["id"])
        self.assertEqual(provenance["values"]["magneticScale"], fit["values"]["magneticScale"])

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
