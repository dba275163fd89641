"""The client's own logic, without a server: the default mapping, the header reader, the multipart body."""

import json
import unittest

from gyrolux.client import _header_cells, _multipart, default_mapping


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


if __name__ == "__main__":
    unittest.main()
