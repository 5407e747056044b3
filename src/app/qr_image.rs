//! The plan's QR code as a picture: black modules on white with a quiet zone of four
//! modules on every side, whatever the app's theme (a camera needs dark on light). The
//! `qrcode` crate makes the module matrix; the pixels are drawn here.

use qrcode::{Color, EcLevel, QrCode};
use slint::{Image, Rgb8Pixel, SharedPixelBuffer};

/// White modules around the code, as the QR standard asks (ISO/IEC 18004: four).
pub const QUIET_ZONE: usize = 4;
/// Pixels per module in the image. The view scales it down to fit, pixel by pixel, so the
/// edges stay sharp; eight keeps a version 20 code under 1000 pixels wide.
pub const MODULE_PX: usize = 8;

/// A QR code's module matrix and what it is.
#[derive(Clone, Debug, PartialEq)]
pub struct QrMatrix {
    /// The QR version (1 to 40).
    pub version: i16,
    /// Modules on a side, without the quiet zone.
    pub modules: usize,
    /// `dark[y * modules + x]`.
    pub dark: Vec<bool>,
}

/// The module matrix of `text`, with medium error correction (about 15 % of the code can
/// be lost: glare on a screen, a thumb on a corner). None when the text is too long for
/// one code.
pub fn qr_matrix(text: &str) -> Option<QrMatrix> {
    let code = QrCode::with_error_correction_level(text.as_bytes(), EcLevel::M).ok()?;
    let version = match code.version() {
        qrcode::Version::Normal(v) | qrcode::Version::Micro(v) => v,
    };
    Some(QrMatrix {
        version,
        modules: code.width(),
        dark: code
            .to_colors()
            .into_iter()
            .map(|c| c == Color::Dark)
            .collect(),
    })
}

/// The matrix drawn at `px` pixels per module, quiet zone included: pure black on pure
/// white.
pub fn qr_pixels(m: &QrMatrix, px: usize) -> SharedPixelBuffer<Rgb8Pixel> {
    let px = px.max(1);
    let side = (m.modules + 2 * QUIET_ZONE) * px;
    let mut buf = SharedPixelBuffer::<Rgb8Pixel>::new(side as u32, side as u32);
    let white = Rgb8Pixel::new(255, 255, 255);
    let black = Rgb8Pixel::new(0, 0, 0);
    let pixels = buf.make_mut_slice();
    for (k, p) in pixels.iter_mut().enumerate() {
        let (x, y) = (k % side / px, k / side / px);
        let dark = x >= QUIET_ZONE
            && y >= QUIET_ZONE
            && x < QUIET_ZONE + m.modules
            && y < QUIET_ZONE + m.modules
            && m.dark[(y - QUIET_ZONE) * m.modules + (x - QUIET_ZONE)];
        *p = if dark { black } else { white };
    }
    buf
}

/// The picture the views show; None when the text does not fit in one code.
pub fn qr_image(text: &str) -> Option<Image> {
    qr_matrix(text).map(|m| Image::from_rgb8(qr_pixels(&m, MODULE_PX)))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn quiet_zone_is_white_and_finder_is_black() {
        let m = qr_matrix("Rule of thirds").unwrap();
        assert_eq!(m.version, 1);
        assert_eq!(m.modules, 21);
        let buf = qr_pixels(&m, 2);
        let side = buf.width() as usize;
        assert_eq!(side, (21 + 8) * 2);
        let at = |x: usize, y: usize| buf.as_slice()[y * side + x];
        // Every pixel of the quiet zone is white.
        for i in 0..side {
            for j in 0..QUIET_ZONE * 2 {
                for p in [at(i, j), at(j, i), at(i, side - 1 - j), at(side - 1 - j, i)] {
                    assert_eq!(p, Rgb8Pixel::new(255, 255, 255));
                }
            }
        }
        // The top-left finder pattern starts right after it.
        assert_eq!(at(8, 8), Rgb8Pixel::new(0, 0, 0));
    }

    #[test]
    fn too_long_a_text_is_refused_not_a_panic() {
        assert_eq!(qr_matrix(&"x".repeat(5000)), None);
    }
}
