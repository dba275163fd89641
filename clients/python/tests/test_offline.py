"""The client's own logic, without a server: the default mapping, the header reader, the multipart body,
the fit's request and save body, and the fit calls against a stand-in server (tests/fake_server.py)."""

import json
import math
import unittest
from datetime import datetime, timezone

from gyrolux import Client, GyroluxError
from gyrolux.client import _header_cells, _multipart, default_mapping
from gyrolux.fit import fit_request, request_conditions, save_fit_body, warnings_of, with_client_keys
from tests.fake_server import FakeServer


class DefaultMappingTest(unittest.TestCase):
    def test_maps_the_default_column_names(self):
        mapping = default_mapping(["wavelength_nm", "verdet_rad_per_T_m", "sigma", "temperature_K", "field_T", "length_m"])
        self.assertEqual(mapping["valueColumn"], "verdet_rad_per_T_m")
        self.assertEqual(mapping["quantity"], "verdet")
        self.assertEqual(mapping["lengthColumn"], "length_m")

    def test_a_rotation_file_and_missing_columns(self):
        mapping = default_mapping(["wavelength_nm", "rotation_rad", "sigma"])
        self.assertEqual((mapping["quantity"], mapping["valueUnit"], mapping["fieldColumn"]), ("rotation", "rad", None))


class HeaderTest(unittest.TestCase):
    def test_reads_numpy_savetxt_header(self):
        text = "# wavelength_nm verdet_rad_per_T_m sigma\n6.328e+02 -1.34e+02 2e+00\n"
        self.assertEqual(_header_cells(text), ["wavelength_nm", "verdet_rad_per_T_m", "sigma"])

    def test_reads_semicolons_after_comments(self):
        self.assertEqual(_header_cells("# made by hand\nwavelength_nm;sigma\n632,8;2\n"), ["wavelength_nm", "sigma"])


class MultipartTest(unittest.TestCase):
    def test_body_holds_fields_and_file(self):
        body, content_type = _multipart({"name": "Set ü", "mapping": json.dumps({"a": 1})}, "file", 'x"y.csv', b"a,b\r\n1,2\r\n", "text/csv")
        boundary = content_type.split("boundary=")[1]
        self.assertTrue(body.startswith(f"--{boundary}\r\n".encode()))
        self.assertIn('name="name"\r\n\r\nSet ü\r\n'.encode("utf-8"), body)
        self.assertIn(b'filename="x_y.csv"', body)
        self.assertIn(b"a,b\r\n1,2\r\n", body)
        self.assertTrue(body.endswith(f"--{boundary}--\r\n".encode()))


PARAMS = {"gyrationPerT": 5e-3, "magneticScale": 1.0, "oscillatorWavelengthNm": 260.0, "temperatureK": 293.15, "fieldT": 1.0,
          "lengthM": 0.01, "wavelengthsNm": [500, 600]}


def stored_point(ordinal, wavelength, value, sigma, temperature=293.15):
    """A point as GET /api/measurement-sets/{id}/points answers it (StoredPoint: the measured point and its bookkeeping)."""
    return {"line": ordinal + 2, "wavelengthNm": wavelength, "quantity": "verdet", "value": value, "sigma": sigma,
            "temperatureK": temperature, "fieldT": 1, "lengthM": 0.01, "ordinal": ordinal, "masked": False,
            "maskReason": None, "note": "", "original": None}


class FitRequestTest(unittest.TestCase):
    def test_points_from_points_take_the_strict_point_shape(self):
        body = fit_request(PARAMS, [stored_point(0, 500, -300.0, 5.0)], free=["gyrationPerT", "magneticScale"])
        self.assertEqual(body["points"], [{"line": 2, "wavelengthNm": 500.0, "quantity": "verdet", "value": -300.0, "sigma": 5.0,
                                           "temperatureK": 293.15, "fieldT": 1.0, "lengthM": 0.01}])
        self.assertNotIn("wavelengthsNm", body["params"])  # the fit's wavelengths are the points'
        self.assertEqual(body["free"], [{"key": "gyrationPerT"}, {"key": "magneticScale"}])
        self.assertEqual(body["calibration"], {"scaleSigma": 0.0, "temperatureSigmaK": 0.0, "relativeFloor": 0.0})
        self.assertEqual((body["starts"], body["seed"], body["takeModelSign"], body["scaleByChi2"]), (4, 1, False, False))

    def test_a_bare_point_takes_line_quantity_and_conditions_from_its_place_and_the_params(self):
        body = fit_request(PARAMS, [{"wavelengthNm": 500, "value": -1, "sigma": 0.1}, {"wavelengthNm": 600, "value": -1, "sigma": 0.1,
                                                                                       "temperatureK": 77}])
        self.assertEqual([p["line"] for p in body["points"]], [2, 3])
        self.assertEqual([p["temperatureK"] for p in body["points"]], [293.15, 77.0])
        self.assertEqual({p["quantity"] for p in body["points"]}, {"verdet"})
        self.assertEqual([f["key"] for f in body["free"]], ["gyrationPerT", "oscillatorWavelengthNm", "magneticScale"])

    def test_bounds_priors_and_sets_with_calibration(self):
        body = fit_request(
            PARAMS,
            free=["gyrationPerT", {"key": "magneticScale", "min": 0, "max": None}],
            priors={"oscillatorWavelengthNm": (258, 8)},
            sets=[{"name": "293 K", "id": "a", "points": [stored_point(0, 500, -300, 5)]},
                  {"name": "77 K", "points": [stored_point(0, 500, -800, 9, 77)], "calibration": {"scale_sigma": 0.02}}],
            magnitudes=True,
            starts=8,
        )
        self.assertEqual(body["free"], [{"key": "gyrationPerT"}, {"key": "magneticScale", "min": 0.0}])
        self.assertEqual(body["priors"], [{"key": "oscillatorWavelengthNm", "mean": 258.0, "sigma": 8.0}])
        self.assertNotIn("points", body)
        self.assertEqual([s["name"] for s in body["sets"]], ["293 K", "77 K"])
        self.assertNotIn("id", body["sets"][0])  # the request's sets are strict: the id stays with the client
        self.assertEqual(body["sets"][1]["calibration"], {"scaleSigma": 0.02, "temperatureSigmaK": 0.0, "relativeFloor": 0.0})
        self.assertEqual((body["takeModelSign"], body["starts"]), (True, 8))
        self.assertEqual(fit_request(PARAMS, [stored_point(0, 500, 1, 1)], priors=[("magneticScale", 2, 1)])["priors"],
                         [{"key": "magneticScale", "mean": 2.0, "sigma": 1.0}])
        conditions = request_conditions(body, [{"name": "293 K", "id": "a"}, {"name": "77 K"}])
        self.assertEqual([(s["name"], s["pointCount"], s.get("id")) for s in conditions["sets"]], [("293 K", 1, "a"), ("77 K", 1, None)])

    def test_bad_arguments_are_refused_with_their_reason(self):
        with self.assertRaisesRegex(ValueError, "either points"):
            fit_request(PARAMS, [stored_point(0, 500, 1, 1)], sets=[])
        with self.assertRaisesRegex(ValueError, "scaleSigma, temperatureSigmaK"):
            fit_request(PARAMS, [stored_point(0, 500, 1, 1)], calibration={"scale": 0.1})
        with self.assertRaisesRegex(ValueError, "no lengthM"):
            fit_request({"temperatureK": 293}, [{"wavelengthNm": 500, "value": 1, "sigma": 1, "fieldT": 1}])


def residual(p, floor=0.0):
    return ((p["measured"] - p["model"]) / math.sqrt(p["sigma"] ** 2 + (floor * p["measured"]) ** 2)) ** 2


def report_of_two_sets():
    """A fit report of two sets in the command line's JSON shape, built so its χ² adds up: the 293 K set's
    points, the 77 K set's (whose temperature σ hides its effective σ), the prior and the 77 K scale factor."""
    points = [
        {"set": "293 K", "wavelengthNm": 500, "measured": -300.0, "sigma": 5.0, "model": -306.0},
        {"set": "293 K", "wavelengthNm": 600, "measured": -200.0, "sigma": 4.0, "model": -197.0},
        {"set": "77 K", "wavelengthNm": 500, "measured": -800.0, "sigma": 9.0, "model": -790.0},
        {"set": "77 K", "wavelengthNm": 600, "measured": -560.0, "sigma": 8.0, "model": -566.0},
    ]
    for p in points:
        p.update({"magneticShare": 0.2, "magneticShareSigma": 0.01, "magneticShareInterval68": None})
    chi2_77 = 1.75  # what the server's effective σ gave for the 77 K points
    values = {"gyrationPerT": 5.3e-3, "magneticScale": 2.1, "oscillatorWavelengthNm": 262.0, "fieldLengthScale[77 K]": 1.01}
    chi2 = residual(points[0], 0.01) + residual(points[1], 0.01) + chi2_77 + ((262 - 258) / 8) ** 2 + ((1.01 - 1) / 0.02) ** 2
    correlation = [[1.0, -0.5, 0.3, 0.1], [-0.5, 1.0, -0.2, 0.05], [0.3, -0.2, 1.0, 0.0], [0.1, 0.05, 0.0, 1.0]]
    result = {
        "free": ["gyrationPerT", "magneticScale"],
        "values": values,
        "sigmas": {"gyrationPerT": 1e-4, "magneticScale": 0.2, "oscillatorWavelengthNm": 6.0, "fieldLengthScale[77 K]": 0.015},
        "correlation": correlation,
        "chi2": chi2,
        "dof": 1,
        "converged": True,
        "notes": ["magneticScale ended on a bound\nof its range"],
        "assumptions": [{"key": "landeG", "value": 1.5, "source": "handbook"}, {"key": "diamagneticTerm", "value": False, "source": "set"}],
        "comparison": [{"hypothesis": "noMagneticPart", "fixed": {"magneticScale": 0}, "chi2": 80.0, "deltaChi2": 78.0,
                        "pValue": 1e-18, "significanceSigma": 8.8, "aic": 90.0, "aicc": None, "bic": 91.0, "words": "In this model …"}],
        "informationCriteria": {"aic": 10.0, "aicc": None, "bic": 11.0},
        "goodnessOfFit": {"chi2": chi2, "dof": 1, "pValue": 0.1},
        "profile": {"magneticScale": {"value": 2.1, "interval68": [1.9, 2.3], "interval95": [1.7, 2.5]}},
        "verdict": {"separable": False, "reasons": ["The data cannot tell the two parts apart."]},
        "points": points,
        "sets": [
            {"name": "293 K", "pointCount": 2, "chi2": residual(points[0], 0.01) + residual(points[1], 0.01),
             "scaleSigma": 0.0, "relativeFloor": 0.01, "temperatureSigmaK": 0.0},
            {"name": "77 K", "pointCount": 2, "chi2": chi2_77, "scaleSigma": 0.02, "relativeFloor": 0.0, "temperatureSigmaK": 0.5},
        ],
        "sigmaScaledByChi2": False,
        "shareCovariance": None,
    }
    body = fit_request(
        PARAMS,
        free=["gyrationPerT", {"key": "magneticScale", "min": 0}],
        priors={"oscillatorWavelengthNm": (258, 8)},
        sets=[{"name": "293 K", "points": [stored_point(0, 500, -300, 5), stored_point(1, 600, -200, 4)],
               "calibration": {"relativeFloor": 0.01}},
              {"name": "77 K", "points": [stored_point(0, 500, -800, 9, 77), stored_point(1, 600, -560, 8, 77)],
               "calibration": {"scaleSigma": 0.02, "temperatureSigmaK": 0.5}}],
    )
    sets = [{"name": "293 K", "id": "11111111-1111-4111-8111-111111111111"}, {"name": "77 K", "id": "22222222-2222-4222-8222-222222222222"}]
    return with_client_keys(result, request_conditions(body, sets)), body, chi2_77


class SaveFitBodyTest(unittest.TestCase):
    def setUp(self):
        self.fit, _, self.chi2_77 = report_of_two_sets()
        self.body = save_fit_body(self.fit, 3, [{"id": "m", "name": "LM-T4"}], datetime(2026, 12, 3, 18, 0, tzinfo=timezone.utc))
        self.summary = self.body["fit"]

    def test_values_sigmas_and_correlation_of_the_free_keys_only(self):
        self.assertEqual(self.body["version"], 3)
        self.assertEqual(self.body["values"], {"gyrationPerT": 5.3e-3, "magneticScale": 2.1})
        self.assertEqual(self.summary["sigmas"], {"gyrationPerT": 1e-4, "magneticScale": 0.2})
        self.assertEqual(self.summary["correlation"], [[1.0, -0.5], [-0.5, 1.0]])
        self.assertEqual(self.summary["free"], [{"key": "gyrationPerT"}, {"key": "magneticScale", "min": 0.0}])
        self.assertEqual(self.summary["nuisances"], [{"name": "oscillatorWavelengthNm", "value": 262.0, "sigma": 6.0},
                                                     {"name": "fieldLengthScale[77 K]", "value": 1.01, "sigma": 0.015}])

    def test_the_correlation_follows_the_order_of_the_fitted_names(self):
        fit = dict(self.fit, free=["magneticScale", "oscillatorWavelengthNm"])
        self.assertEqual(save_fit_body(fit, 1, [{"id": "m", "name": "x"}])["fit"]["correlation"], [[1.0, -0.2], [-0.2, 1.0]])

    def test_the_report_and_the_request_conditions_go_with_it(self):
        s = self.summary
        self.assertEqual((s["pointCount"], s["chi2"], s["dof"], s["reducedChi2"]), (4, self.fit["chi2"], 1, self.fit["chi2"]))
        self.assertEqual((s["separable"], s["sigmaScaledByChi2"], s["starts"], s["tookModelSign"]), (False, False, 4, False))
        self.assertEqual(s["fittedAt"], "2026-12-03T18:00:00.000Z")
        self.assertEqual(s["priors"], [{"key": "oscillatorWavelengthNm", "mean": 258.0, "sigma": 8.0}])
        self.assertEqual(s["comparison"][0]["hypothesis"], "noMagneticPart")
        self.assertEqual(s["profile"]["magneticScale"]["interval68"], [1.9, 2.3])
        self.assertEqual(s["verdict"], {"separable": False, "reasons": ["The data cannot tell the two parts apart."]})
        self.assertEqual(s["notes"], ["magneticScale ended on a bound\nof its range"])
        self.assertEqual(s["assumptions"][1], {"key": "diamagneticTerm", "value": False, "source": "set"})
        self.assertEqual(s["goodnessOfFit"]["dof"], 1)

    def test_each_sets_chi2_and_calibration_as_the_report_gives_them(self):
        self.assertEqual(self.summary["sets"], self.fit["sets"])

    def test_sets_left_out_when_the_report_has_none(self):
        fit = {k: v for k, v in self.fit.items() if k != "sets"}
        self.assertNotIn("sets", save_fit_body(fit, 1, [{"id": "m", "name": "x"}])["fit"])

    def test_a_profile_without_finite_ends_is_not_stored(self):
        fit = dict(self.fit, profile={"magneticScale": {"value": 2.1, "interval68": None, "interval95": [1.7, 2.5]}})
        self.assertEqual(save_fit_body(fit, 1, [{"id": "m", "name": "x"}])["fit"]["profile"], {})

    def test_warnings_are_the_verdicts_reasons_and_the_notes_on_one_line_each(self):
        lines = ["The data cannot tell the two parts apart.", "magneticScale ended on a bound of its range"]
        self.assertEqual(warnings_of(self.fit), lines)
        self.assertEqual(self.fit["warnings"], warnings_of(self.fit))


class FitOverHttpTest(unittest.TestCase):
    def test_fit_posts_the_request_with_the_token_and_answers_the_report(self):
        report, body, _ = report_of_two_sets()
        for key in ("warnings", "scaledByChi2", "request"):
            report.pop(key)
        answers = {("POST", "/api/compute/fit"): (200, {"engineVersion": "e1", "computeMs": 12, "result": report})}
        with FakeServer(answers) as server:
            fit = Client(server.url, "glx_test").fit(
                PARAMS, free=["gyrationPerT", {"key": "magneticScale", "min": 0}], priors={"oscillatorWavelengthNm": (258, 8)},
                sets=[{"name": s["name"], "points": s["points"], "calibration": s["calibration"]} for s in body["sets"]],
                share_intervals=True,
            )
        sent = server.requests[0]
        self.assertEqual((sent["method"], sent["path"], sent["query"]), ("POST", "/api/compute/fit", {"shareIntervals": "true"}))
        self.assertEqual(sent["headers"]["Authorization"], "Bearer glx_test")
        self.assertEqual(sent["body"], body)
        self.assertEqual((fit["engineVersion"], fit["computeMs"], fit["scaledByChi2"]), ("e1", 12, False))
        self.assertEqual(fit["warnings"][0], "The data cannot tell the two parts apart.")
        self.assertNotIn("points", fit["request"]["sets"][0])

    def test_too_many_points_names_the_command_line(self):
        too_large = {"error": {"code": "payload_too_large", "message": "This fit has 501 points; the synchronous endpoint fits up to 500."}}
        with FakeServer({("POST", "/api/compute/fit"): (413, too_large)}) as server:
            with self.assertRaises(GyroluxError) as caught:
                Client(server.url, "t").fit(PARAMS, [stored_point(i, 500 + i, -300, 5) for i in range(501)])
        error = caught.exception
        self.assertEqual((error.status, error.code), (413, "payload_too_large"))
        self.assertIn("501 points", error.message)
        self.assertIn("local=True", error.message)

    def test_save_fit_names_the_sets_the_fit_had_and_starts_from_the_current_version(self):
        fit, _, _ = report_of_two_sets()
        set_id = "33333333-3333-4333-8333-333333333333"
        answers = {
            ("GET", f"/api/parameter-sets/{set_id}"): (200, {"item": {"id": set_id, "version": 7}}),
            ("POST", f"/api/parameter-sets/{set_id}/fits"): (201, {"item": {"id": set_id, "version": 8}}),
        }
        with FakeServer(answers) as server:
            saved = Client(server.url, "t").save_fit(set_id, fit)
        self.assertEqual(saved["version"], 8)
        sent = server.requests[-1]["body"]
        self.assertEqual(sent["version"], 7)
        self.assertEqual([m["name"] for m in sent["fit"]["measurementSets"]], ["293 K", "77 K"])
        with self.assertRaisesRegex(ValueError, "name the measurement sets"):
            Client("http://127.0.0.1:9", "t").save_fit(set_id, dict(fit, request=None), version=1)


if __name__ == "__main__":
    unittest.main()
