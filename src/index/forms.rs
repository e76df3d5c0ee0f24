//! The surface forms of an index: every distinct term of every field, once.

use super::sidecar::{Decoder, Encoder};

/// The distinct surface forms of a surface index, shared by both sides of a preview: each
/// ruleset keys every form once, whichever fields hold it.
#[derive(Clone, Debug, Default, PartialEq, Eq)]
pub struct SurfaceForms {
    /// Every distinct form of every field, sorted.
    pub forms: Vec<String>,
    /// Per field: the forms it holds, as ascending indices into `forms`.
    pub fields: Vec<Vec<u32>>,
}

impl SurfaceForms {
    /// From each field's terms (each list sorted, without repeats).
    pub fn from_fields(fields: &[Vec<String>]) -> SurfaceForms {
        let mut forms: Vec<&str> = fields.iter().flatten().map(String::as_str).collect();
        // The lists are sorted runs: a stable sort merges them.
        forms.sort();
        forms.dedup();
        let places = fields
            .iter()
            .map(|list| {
                // Both lists are sorted: one forward walk finds every place.
                let mut at = 0;
                list.iter()
                    .map(|form| {
                        at += forms[at..].partition_point(|d| *d < form.as_str());
                        at as u32
                    })
                    .collect()
            })
            .collect();
        SurfaceForms {
            forms: forms.into_iter().map(str::to_string).collect(),
            fields: places,
        }
    }

    pub fn len(&self) -> usize {
        self.forms.len()
    }

    pub fn is_empty(&self) -> bool {
        self.forms.is_empty()
    }

    /// The `i`-th distinct form.
    pub fn form(&self, i: u32) -> &str {
        &self.forms[i as usize]
    }

    /// Whether `field` holds the `i`-th distinct form.
    pub fn in_field(&self, field: usize, i: u32) -> bool {
        self.fields[field].binary_search(&i).is_ok()
    }

    /// The forms `field` holds, sorted.
    pub fn of_field(&self, field: usize) -> impl Iterator<Item = &str> {
        self.fields[field].iter().map(|&i| self.form(i))
    }

    pub(crate) fn encode(&self, e: &mut Encoder) {
        e.strings(&self.forms);
        e.u32(self.fields.len() as u32);
        for list in &self.fields {
            e.u32s(list);
        }
    }

    /// The forms decoded, if they are consistent (indices in range and ascending).
    pub(crate) fn decode(d: &mut Decoder) -> Option<SurfaceForms> {
        let forms = d.strings()?;
        let n = d.u32()? as usize;
        let fields = (0..n).map(|_| d.u32s()).collect::<Option<Vec<_>>>()?;
        let valid = fields.iter().all(|list| {
            list.is_sorted_by(|a, b| a < b)
                && list.last().is_none_or(|&i| (i as usize) < forms.len())
        });
        valid.then_some(SurfaceForms { forms, fields })
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn strings(v: &[&str]) -> Vec<String> {
        v.iter().map(|s| s.to_string()).collect()
    }

    #[test]
    fn fields_share_one_sorted_list_of_forms() {
        let forms = SurfaceForms::from_fields(&[
            strings(&["bus", "ferry", "tram"]),
            strings(&["alpha", "ferry", "zebra"]),
        ]);
        assert_eq!(forms.forms, ["alpha", "bus", "ferry", "tram", "zebra"]);
        assert_eq!(forms.fields, [vec![1, 2, 3], vec![0, 2, 4]]);
        assert!(forms.in_field(1, 2) && !forms.in_field(1, 1));
        assert_eq!(
            forms.of_field(1).collect::<Vec<_>>(),
            ["alpha", "ferry", "zebra"]
        );
        let mut e = Encoder::default();
        forms.encode(&mut e);
        let bytes = e.into_bytes();
        let mut d = Decoder::new(&bytes);
        assert_eq!(SurfaceForms::decode(&mut d), Some(forms));
        assert!(d.is_done());
    }
}
