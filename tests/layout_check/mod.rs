//! Every text element of the window as the toolkit laid it out, read from Slint's item
//! tree (`i-slint-core`, pinned with the testing backend): its words, where it is, the
//! room its words need (the toolkit's own measure: the longest word for wrapping text,
//! the whole line otherwise), its colour and what is painted behind it.
//!
//! `problems` names each text that a diver could not read whole:
//! - wider than its box (a unit cut off, digits over a border), or cut short with "…";
//! - a word split across lines (its longest word wider than the box);
//! - taller than its box (wrapped lines cut at the bottom);
//! - outside what can be seen or scrolled to (past the window, or past the end of a
//!   scrolling area's content);
//! - on top of another text;
//! - inside a button, closer than `BUTTON_INSET` to the button's border.

#![allow(dead_code)]

use std::ops::ControlFlow;

use i_slint_core::graphics::Color;
use i_slint_core::item_tree::{ItemRc, ParentItemTraversalMode};
use i_slint_core::items::{
    AccessibleRole, BasicBorderRectangle, BorderRectangle, Clip, ComplexText, Flickable, Opacity,
    Rectangle, SimpleText, TextHorizontalAlignment, TextOverflow, TextWrap, WindowItem,
};
use i_slint_core::layout::Orientation;
use i_slint_core::window::WindowInner;

/// Room kept between a button's border and its words, in px.
pub const BUTTON_INSET: f32 = 6.0;
/// Rounding allowance of the layout, in px.
const SLACK: f32 = 1.0;

#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Rect {
    pub x: f32,
    pub y: f32,
    pub w: f32,
    pub h: f32,
}

impl Rect {
    fn of(item: &ItemRc) -> Rect {
        let g = item.geometry();
        let p = item.map_to_window(g.origin);
        Rect {
            x: p.x,
            y: p.y,
            w: g.size.width,
            h: g.size.height,
        }
    }
    fn right(&self) -> f32 {
        self.x + self.w
    }
    fn bottom(&self) -> f32 {
        self.y + self.h
    }
    /// Whether `self` lies inside `outer`, give or take `slack`.
    pub fn inside(&self, outer: &Rect, slack: f32) -> bool {
        self.x >= outer.x - slack
            && self.y >= outer.y - slack
            && self.right() <= outer.right() + slack
            && self.bottom() <= outer.bottom() + slack
    }
    fn overlap(&self, o: &Rect) -> f32 {
        let w = self.right().min(o.right()) - self.x.max(o.x);
        let h = self.bottom().min(o.bottom()) - self.y.max(o.y);
        if w > 0.0 && h > 0.0 { w.min(h) } else { 0.0 }
    }
    fn contains(&self, x: f32, y: f32) -> bool {
        x >= self.x && x <= self.right() && y >= self.y && y <= self.bottom()
    }
}

/// One text element as laid out.
#[derive(Clone, Debug)]
pub struct TextBox {
    pub text: String,
    /// The element's box.
    pub rect: Rect,
    /// Where its glyphs are: the box narrowed to the words' width, as aligned.
    pub ink: Rect,
    /// The toolkit's smallest width for the words: the longest word when wrapping,
    /// the whole line otherwise.
    pub min_width: f32,
    /// The width of all its words on one line.
    pub line_width: f32,
    /// The height its words need at the box's width.
    pub need_height: f32,
    pub wraps: bool,
    pub elides: bool,
    pub colour: Color,
    /// What is painted behind the middle of its glyphs (opaque).
    pub background: Color,
    /// The button the words are on, if any.
    pub in_button: Option<Rect>,
    /// Painted over by something mostly opaque (an overlay's scrim or panel).
    pub covered: bool,
    /// The area it must lie in to be seen: a scrolling area's whole content, or the window.
    pub reachable: Rect,
    /// The boxes of clipping elements around it, inside that area.
    pub clips: Vec<Rect>,
    /// Order of painting.
    order: usize,
}

struct Painted {
    rect: Rect,
    colour: Color,
    order: usize,
}

/// Every shown text element of the window and what is painted under it.
pub fn texts(window: &slint::Window) -> Vec<TextBox> {
    let inner = WindowInner::from_pub(window);
    let adapter = inner.window_adapter();
    let size = window.size().to_logical(window.scale_factor());
    let screen = Rect {
        x: 0.0,
        y: 0.0,
        w: size.width,
        h: size.height,
    };
    let root = ItemRc::new_root(inner.component());
    // The window's own background (dark or light theme) under everything.
    let ground = root
        .downcast::<WindowItem>()
        .map(|w| w.as_pin_ref().background().color())
        .filter(|c| c.alpha() == 255)
        .unwrap_or(Color::from_rgb_u8(0, 0, 0));
    let mut painted = vec![Painted {
        rect: screen,
        colour: ground,
        order: 0,
    }];
    let mut out = Vec::new();
    let mut order = 0;
    root.visit_descendants(|item| -> ControlFlow<()> {
        order += 1;
        if hidden(item) {
            return ControlFlow::Continue(());
        }
        let rect = Rect::of(item);
        if let Some(bg) = background(item)
            && bg.alpha() > 0
        {
            painted.push(Painted {
                rect,
                colour: bg,
                order,
            });
        }
        let Some(t) = text_of(item) else {
            return ControlFlow::Continue(());
        };
        if rect.h <= 0.0 {
            return ControlFlow::Continue(());
        }
        let h = item
            .borrow()
            .as_ref()
            .layout_info(Orientation::Horizontal, -1.0, &adapter, item);
        // A blank text draws nothing, unless its box is too narrow for it and it
        // elides: then it draws "…" where the diver expects an empty field.
        let draws_ellipsis = t.elides && h.preferred > rect.w + SLACK;
        if (t.text.trim().is_empty() || rect.w <= 0.0) && !draws_ellipsis {
            return ControlFlow::Continue(());
        }
        let v = item
            .borrow()
            .as_ref()
            .layout_info(Orientation::Vertical, rect.w, &adapter, item);
        let ink_w = if t.wraps {
            h.preferred.min(rect.w)
        } else {
            h.preferred
        };
        let ink_x = match t.align {
            TextHorizontalAlignment::Center => rect.x + (rect.w - ink_w) / 2.0,
            TextHorizontalAlignment::Right | TextHorizontalAlignment::End => rect.right() - ink_w,
            _ => rect.x,
        };
        let ink_h = v.preferred.min(rect.h);
        let ink = Rect {
            x: ink_x,
            y: rect.y + (rect.h - ink_h) / 2.0,
            w: ink_w,
            h: ink_h,
        };
        let (reachable, clips, in_button) = surroundings(item, screen);
        out.push(TextBox {
            text: t.text,
            rect,
            ink,
            min_width: h.min,
            line_width: h.preferred,
            need_height: v.min,
            wraps: t.wraps,
            elides: t.elides,
            colour: with_opacity(t.colour, item),
            background: Color::from_rgb_u8(0, 0, 0),
            in_button,
            covered: false,
            reachable,
            clips,
            order,
        });
        ControlFlow::Continue(())
    });
    for t in &mut out {
        let (cx, cy) = (t.ink.x + t.ink.w / 2.0, t.ink.y + t.ink.h / 2.0);
        let mut under = ground;
        for p in painted.iter().filter(|p| p.order < t.order) {
            if p.rect.contains(cx, cy) {
                under = blend(p.colour, under);
            }
        }
        t.background = under;
        t.covered = painted
            .iter()
            .any(|p| p.order > t.order && p.colour.alpha() >= 128 && p.rect.contains(cx, cy));
    }
    out
}

struct TextProps {
    text: String,
    wraps: bool,
    elides: bool,
    align: TextHorizontalAlignment,
    colour: Color,
}

fn text_of(item: &ItemRc) -> Option<TextProps> {
    if let Some(t) = item.downcast::<ComplexText>() {
        let t = t.as_pin_ref();
        return Some(TextProps {
            text: t.text().to_string(),
            wraps: t.wrap() != TextWrap::NoWrap,
            elides: t.overflow() == TextOverflow::Elide,
            align: t.horizontal_alignment(),
            colour: t.color().color(),
        });
    }
    let t = item.downcast::<SimpleText>()?;
    let t = t.as_pin_ref();
    Some(TextProps {
        text: t.text().to_string(),
        wraps: false,
        elides: false,
        align: t.horizontal_alignment(),
        colour: t.color().color(),
    })
}

fn background(item: &ItemRc) -> Option<Color> {
    if let Some(r) = item.downcast::<Rectangle>() {
        return Some(r.as_pin_ref().background().color());
    }
    if let Some(r) = item.downcast::<BasicBorderRectangle>() {
        return Some(r.as_pin_ref().background().color());
    }
    item.downcast::<BorderRectangle>()
        .map(|r| r.as_pin_ref().background().color())
}

fn ancestors(item: &ItemRc) -> impl Iterator<Item = ItemRc> {
    std::iter::successors(Some(item.clone()), |i| {
        i.parent_item(ParentItemTraversalMode::StopAtPopups)
    })
    .skip(1)
}

/// Not shown: inside an element with `visible: false`, fully transparent, or of no size.
fn hidden(item: &ItemRc) -> bool {
    std::iter::once(item.clone())
        .chain(ancestors(item))
        .any(|a| {
            let g = a.geometry();
            let invisible = a.downcast::<Clip>().is_some_and(|c| {
                let c = c.as_pin_ref();
                c.is_visibility_clip() && c.clip()
            });
            let clear = a
                .downcast::<Opacity>()
                .is_some_and(|o| o.as_pin_ref().opacity() <= 0.0);
            invisible || clear || (a.index() != 0 && (g.size.width <= 0.0 || g.size.height <= 0.0))
        })
}

/// The area a text can be seen or scrolled to, the clipping boxes on the way there, and
/// the button it is on, if any.
fn surroundings(item: &ItemRc, screen: Rect) -> (Rect, Vec<Rect>, Option<Rect>) {
    let mut clips = Vec::new();
    let mut button = None;
    for a in ancestors(item) {
        if button.is_none() && a.accessible_role() == AccessibleRole::Button {
            button = Some(Rect::of(&a));
        }
        if let Some(f) = a.downcast::<Flickable>() {
            // The content scrolls up and down: what lies inside the flickable's content
            // can be reached. Not sideways: a page a diver must also pan left and right
            // hides the ends of its lines, so only the flickable's own width counts.
            let f = f.as_pin_ref();
            let at = Rect::of(&a);
            let content = Rect {
                x: at.x,
                y: at.y + f.content_y().0,
                w: at.w,
                h: f.content_height().0.max(at.h),
            };
            return (content, clips, button);
        }
        if let Some(c) = a.downcast::<Clip>() {
            let c = c.as_pin_ref();
            if c.clip() && !c.is_visibility_clip() {
                clips.push(Rect::of(&a));
            }
        }
    }
    (screen, clips, button)
}

fn with_opacity(c: Color, item: &ItemRc) -> Color {
    let mut a = c.alpha() as f32 / 255.0;
    for o in ancestors(item) {
        if let Some(op) = o.downcast::<Opacity>() {
            a *= op.as_pin_ref().opacity();
        }
    }
    Color::from_argb_u8((a * 255.0).round() as u8, c.red(), c.green(), c.blue())
}

/// `top` painted over the opaque `under`.
pub fn blend(top: Color, under: Color) -> Color {
    let a = top.alpha() as f32 / 255.0;
    let mix = |t: u8, u: u8| (t as f32 * a + u as f32 * (1.0 - a)).round() as u8;
    Color::from_rgb_u8(
        mix(top.red(), under.red()),
        mix(top.green(), under.green()),
        mix(top.blue(), under.blue()),
    )
}

/// WCAG 2.1 contrast ratio of two opaque colours (its relative-luminance formula).
pub fn contrast(a: Color, b: Color) -> f64 {
    let lum = |c: Color| {
        let lin = |x: u8| {
            let x = x as f64 / 255.0;
            if x <= 0.03928 {
                x / 12.92
            } else {
                ((x + 0.055) / 1.055).powf(2.4)
            }
        };
        0.2126 * lin(c.red()) + 0.7152 * lin(c.green()) + 0.0722 * lin(c.blue())
    };
    let (la, lb) = (lum(a), lum(b));
    (la.max(lb) + 0.05) / (la.min(lb) + 0.05)
}

/// Every shown text under 7:1 against what is painted behind it (WCAG 2.1, 1.4.6), one
/// line each, led by `state`.
pub fn low_contrast(window: &slint::Window, state: &str) -> Vec<String> {
    texts(window)
        .into_iter()
        .filter(|t| !t.covered && t.colour.alpha() > 0)
        .filter_map(|t| {
            let c = contrast(blend(t.colour, t.background), t.background);
            (c < 7.0).then(|| format!("{state}: {:?} is {c:.2}:1 on its ground", short(&t.text)))
        })
        .collect()
}

/// The words of a text, shortened for a message.
fn short(t: &str) -> String {
    let t = t.replace(['\u{a0}', '\n'], " ");
    if t.chars().count() > 40 {
        format!("{}…", t.chars().take(40).collect::<String>())
    } else {
        t
    }
}

/// Every text a diver could not read whole, one line each, led by `state`.
pub fn problems(window: &slint::Window, state: &str) -> Vec<String> {
    let all = texts(window);
    let mut out = Vec::new();
    for t in &all {
        let name = short(&t.text);
        let r = t.rect;
        if t.colour.alpha() == 0 {
            // Laid out but drawn in no colour: words the diver is meant to read, withheld.
            out.push(format!("{state}: {name:?} is laid out but drawn invisible"));
            continue;
        }
        if !t.wraps && !t.elides && t.min_width > r.w + SLACK {
            out.push(format!(
                "{state}: {name:?} is wider than its box ({:.0} px in {:.0} px)",
                t.min_width, r.w
            ));
        }
        if t.elides && t.line_width > r.w + SLACK {
            out.push(format!(
                "{state}: {name:?} is cut short with … ({:.0} px in {:.0} px)",
                t.line_width, r.w
            ));
        }
        if t.wraps && t.min_width > r.w + SLACK {
            out.push(format!(
                "{state}: {name:?} splits a word ({:.0} px longest word in {:.0} px)",
                t.min_width, r.w
            ));
        }
        if t.need_height > r.h + SLACK {
            out.push(format!(
                "{state}: {name:?} is cut at the bottom ({:.0} px of lines in {:.0} px)",
                t.need_height, r.h
            ));
        }
        if !t.ink.inside(&t.reachable, SLACK) {
            out.push(format!(
                "{state}: {name:?} at x {:.0}–{:.0}, y {:.0}–{:.0} cannot be seen or scrolled to (area x {:.0}–{:.0}, y {:.0}–{:.0})",
                t.ink.x,
                t.ink.right(),
                t.ink.y,
                t.ink.bottom(),
                t.reachable.x,
                t.reachable.right(),
                t.reachable.y,
                t.reachable.bottom()
            ));
        } else if let Some(c) = t.clips.iter().find(|c| !t.ink.inside(c, SLACK)) {
            out.push(format!(
                "{state}: {name:?} reaches past its clipping box (y {:.0}–{:.0} in {:.0}–{:.0})",
                t.ink.y,
                t.ink.bottom(),
                c.y,
                c.bottom()
            ));
        }
        if let Some(b) = t.in_button {
            let room = Rect {
                x: b.x + BUTTON_INSET,
                y: b.y,
                w: b.w - 2.0 * BUTTON_INSET,
                h: b.h,
            };
            if t.ink.w > 0.0 && !(t.ink.x >= room.x - 0.5 && t.ink.right() <= room.right() + 0.5) {
                out.push(format!(
                    "{state}: {name:?} comes within {BUTTON_INSET} px of its button's border"
                ));
            }
        }
    }
    for (i, a) in all.iter().enumerate() {
        for b in all[i + 1..].iter().filter(|b| !a.covered && !b.covered) {
            // Both shown in the same place: one hides the other.
            if a.ink.overlap(&b.ink) > 2.0 && a.reachable == b.reachable {
                out.push(format!(
                    "{state}: {:?} and {:?} are drawn over each other",
                    short(&a.text),
                    short(&b.text)
                ));
            }
        }
    }
    out
}
