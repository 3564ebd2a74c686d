//! Which old row each new row of a wing takes the table (and the comments) of, when a wing is
//! saved into the text it came from: in time and memory linear in the rows for the usual few
//! changes, so a wing of tens of thousands of stations saves as quickly as a small one.

/// Largest table of common-subsequence lengths built for one stretch of changed rows; past it
/// the rows are matched by a bounded look-ahead instead, so saving a wing of tens of thousands
/// of stations stays linear in time and memory.
const EXACT_CELLS: usize = 1 << 20;
/// How far ahead the bounded matching looks for a row that was kept.
const LOOK_AHEAD: usize = 16;

/// For each new item, the old item whose table it takes over (`None`: a new table). Equal
/// items are matched first; between two matches, items that are `like` each other (the same
/// station moved or edited) are matched next, and the rest pair up in order. So an edited row
/// keeps its table and comments, an inserted one gets a new one.
pub(super) fn align<T: PartialEq>(
    old: &[T],
    new: &[T],
    like: fn(&T, &T) -> bool,
) -> Vec<Option<usize>> {
    let mut out = vec![None; new.len()];
    let mut gap_start = (0, 0);
    let strict = matches(old, new, &|a: &T, b: &T| a == b);
    for &(i, j) in strict
        .iter()
        .chain(std::iter::once(&(old.len(), new.len())))
    {
        let (oi, nj) = gap_start;
        let (old_gap, new_gap) = (&old[oi..i], &new[nj..j]);
        let loose = matches(old_gap, new_gap, &like);
        pair_in_order(&loose, old_gap.len(), new_gap.len(), &mut out[nj..j], oi);
        if j < new.len() {
            out[j] = Some(i);
        }
        gap_start = (i + 1, j + 1);
    }
    out
}

/// Fills `slots` (one per new item of a gap) from `found` matches inside the gap, pairing the
/// items between matches in order; `offset` turns gap indices into whole-list ones.
fn pair_in_order(
    found: &[(usize, usize)],
    n: usize,
    m: usize,
    slots: &mut [Option<usize>],
    offset: usize,
) {
    let (mut from_old, mut from_new) = (0, 0);
    for &(mi, mj) in found.iter().chain(std::iter::once(&(n, m))) {
        for (k, slot) in slots[from_new..mj].iter_mut().enumerate() {
            *slot = (from_old + k < mi).then_some(offset + from_old + k);
        }
        if mj < m {
            slots[mj] = Some(offset + mi);
        }
        (from_old, from_new) = (mi + 1, mj + 1);
    }
}

/// Pairs `(old, new)` of items that are `eq`, in increasing order of both: the common prefix
/// and suffix, and between them a longest common subsequence when that is small enough, else
/// a bounded look-ahead match (linear, and exact for the usual few inserted, deleted or
/// edited rows).
fn matches<T>(old: &[T], new: &[T], eq: &dyn Fn(&T, &T) -> bool) -> Vec<(usize, usize)> {
    let prefix = old.iter().zip(new).take_while(|(a, b)| eq(a, b)).count();
    let (old_rest, new_rest) = (&old[prefix..], &new[prefix..]);
    let suffix = old_rest
        .iter()
        .rev()
        .zip(new_rest.iter().rev())
        .take_while(|(a, b)| eq(a, b))
        .count();
    let (mid_old, mid_new) = (
        &old_rest[..old_rest.len() - suffix],
        &new_rest[..new_rest.len() - suffix],
    );
    let middle = if mid_old.len().saturating_mul(mid_new.len()) <= EXACT_CELLS {
        common_subsequence(mid_old, mid_new, eq)
    } else {
        look_ahead(mid_old, mid_new, eq)
    };
    let mut out: Vec<(usize, usize)> = (0..prefix).map(|k| (k, k)).collect();
    out.extend(middle.into_iter().map(|(i, j)| (i + prefix, j + prefix)));
    let (tail_old, tail_new) = (old.len() - suffix, new.len() - suffix);
    out.extend((0..suffix).map(|k| (tail_old + k, tail_new + k)));
    out
}

/// A longest common subsequence by the textbook table (quadratic; kept for short stretches).
fn common_subsequence<T>(old: &[T], new: &[T], eq: &dyn Fn(&T, &T) -> bool) -> Vec<(usize, usize)> {
    let (n, m) = (old.len(), new.len());
    let mut common = vec![vec![0_usize; m + 1]; n + 1];
    for i in (0..n).rev() {
        for j in (0..m).rev() {
            common[i][j] = if eq(&old[i], &new[j]) {
                common[i + 1][j + 1] + 1
            } else {
                common[i + 1][j].max(common[i][j + 1])
            };
        }
    }
    let mut out = Vec::new();
    let (mut i, mut j) = (0, 0);
    while i < n && j < m {
        if eq(&old[i], &new[j]) {
            out.push((i, j));
            i += 1;
            j += 1;
        } else if common[i + 1][j] >= common[i][j + 1] {
            i += 1;
        } else {
            j += 1;
        }
    }
    out
}

/// Matches in one pass: equal items pair; otherwise the nearest item within [`LOOK_AHEAD`]
/// on either side that pairs with the other's current one is taken (an insertion or a
/// deletion), else both are skipped (an edit).
fn look_ahead<T>(old: &[T], new: &[T], eq: &dyn Fn(&T, &T) -> bool) -> Vec<(usize, usize)> {
    let mut out = Vec::new();
    let (mut i, mut j) = (0, 0);
    while i < old.len() && j < new.len() {
        if eq(&old[i], &new[j]) {
            out.push((i, j));
            i += 1;
            j += 1;
            continue;
        }
        let skip = (1..=LOOK_AHEAD).find_map(|d| {
            if new.get(j + d).is_some_and(|b| eq(&old[i], b)) {
                Some((0, d))
            } else if old.get(i + d).is_some_and(|a| eq(a, &new[j])) {
                Some((d, 0))
            } else {
                None
            }
        });
        let (di, dj) = skip.unwrap_or((1, 1));
        i += di;
        j += dj;
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    fn never(_: &i32, _: &i32) -> bool {
        false
    }

    #[test]
    fn alignment_matches_equal_rows_and_pairs_the_rest_in_order() {
        let align = |a: &[i32], b: &[i32]| align(a, b, never);
        assert_eq!(align(&[1, 2, 3], &[1, 2, 3]), [Some(0), Some(1), Some(2)]);
        assert_eq!(align(&[1, 3], &[1, 2, 3]), [Some(0), None, Some(1)]);
        assert_eq!(align(&[1, 2, 3], &[1, 3]), [Some(0), Some(2)]);
        assert_eq!(align(&[1, 2, 3], &[1, 9, 3]), [Some(0), Some(1), Some(2)]);
        assert_eq!(align(&[1, 2], &[7, 8, 2]), [Some(0), None, Some(1)]);
        assert_eq!(align(&[], &[4]), [None]);
    }

    #[test]
    fn an_edited_row_beside_an_inserted_one_keeps_its_own_table() {
        // Old rows 10 20 30; new: 10, an inserted 15, 20 edited to 21, 30. Rows are `like`
        // when they are within 2 of each other.
        fn near(a: &i32, b: &i32) -> bool {
            (a - b).abs() <= 2
        }
        assert_eq!(
            align(&[10, 20, 30], &[10, 15, 21, 30], near),
            [Some(0), None, Some(1), Some(2)]
        );
    }

    #[test]
    fn long_lists_align_in_one_pass() {
        // Large enough that the quadratic table would not fit in memory; an edit at each end
        // and an insertion in the middle.
        let n = 200_000;
        let old: Vec<i32> = (0..n).collect();
        let mut new = old.clone();
        new[0] = -1;
        new[n as usize - 1] = -2;
        new.insert(100_000, -3);
        let got = align(&old, &new, never);
        assert_eq!(got.len(), new.len());
        assert_eq!(got[0], Some(0));
        assert_eq!(got[100_000], None, "the inserted row gets a new table");
        assert_eq!(got[100_001], Some(100_000));
        assert_eq!(got[new.len() - 1], Some(n as usize - 1));
    }
}
